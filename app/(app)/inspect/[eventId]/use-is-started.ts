'use client';

import { useSyncExternalStore } from 'react';

const subscribeToNothing = () => () => {};
const inBrowser = () => true;
const onServer = () => false;

/**
 * Whether the page has started in the browser: false on the server and while React hydrates the server's HTML, true
 * after (and at once for a part drawn in the browser). For what the server cannot know or must not allow before the
 * page's script runs: the phone's own clock, a form that came in the first HTML.
 */
export function useIsStarted(): boolean {
  return useSyncExternalStore(subscribeToNothing, inBrowser, onServer);
}
