'use client';

import { useEffect } from 'react';

/**
 * Holds the phone's screen on while a record is open (Screen Wake Lock API, W3C): a phone that locks itself in
 * the middle of a measurement costs the scrutineer the unlock and their place. The browser lets go of the lock
 * when the page is hidden, so it is asked for again when the page is shown; it is released when the record
 * closes (the component using this leaves). Where the browser has no wake lock, or refuses one (battery saver),
 * nothing else changes.
 */
export function useScreenAwake(isWanted = true) {
  useEffect(() => {
    if (!isWanted || !('wakeLock' in navigator)) return;
    let lock: WakeLockSentinel | null = null;
    let isLeft = false;
    let isAsking = false;
    const hold = async () => {
      if (isLeft || isAsking || document.visibilityState !== 'visible' || (lock && !lock.released)) return;
      isAsking = true;
      try {
        const got = await navigator.wakeLock.request('screen');
        if (isLeft) await got.release();
        else lock = got;
      } catch {
        // refused (battery saver, a hidden page): the screen may dim as usual
      } finally {
        isAsking = false;
      }
    };
    const onShown = () => void hold();
    void hold();
    document.addEventListener('visibilitychange', onShown);
    return () => {
      isLeft = true;
      document.removeEventListener('visibilitychange', onShown);
      void lock?.release().catch(() => undefined);
    };
  }, [isWanted]);
}
