'use client';

import { useLinkStatus } from 'next/link';

/**
 * Shown while the page a link opens is on its way (links fetch nothing in advance, components/link.tsx, and some
 * pages have no loading skeleton, so a tap would otherwise look dead on a slow link): a bar along the top of the
 * screen, fixed so that nothing moves, and the words for a screen reader. Rendered inside the link that was
 * followed; gone once the new page shows.
 */
export function LinkPending() {
  const { pending } = useLinkStatus();
  if (!pending) return null;
  return (
    <span data-testid="link-pending" className="link-pending" role="status">
      <span className="sr-only">Opening the page…</span>
    </span>
  );
}
