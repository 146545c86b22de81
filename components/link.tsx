import NextLink from 'next/link';
import type { ComponentProps } from 'react';
import { LinkPending } from './link-pending';

/**
 * Next.js's Link without the prefetch of every link in view. On one bar of signal at the dock, each page's
 * links (the dock's own four, the header's, a list's rows) fetched their pages in the background while the
 * page in use was still loading: twelve requests on the dock alone, and their payloads parsed on the phone's
 * main thread. With the App Router, `prefetch={false}` means no prefetch at all, not on hover either: a
 * page is fetched when its link is followed. A link that should prefetch says so (`prefetch`). While the
 * followed page is on its way, the link shows it (LinkPending: a bar along the top of the screen).
 */
export default function Link({ prefetch = false, children, ...props }: ComponentProps<typeof NextLink>) {
  return (
    <NextLink prefetch={prefetch} {...props}>
      {children}
      <LinkPending />
    </NextLink>
  );
}
