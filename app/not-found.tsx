import type { Metadata } from 'next';
import Link from '@/components/link';
import { CardPage } from '@/components/card-page';

export const metadata: Metadata = { title: 'Page not found', robots: { index: false, follow: false } };

// Any address Boreline does not know, in Boreline's own look, with the ways back.
export default function NotFound() {
  return (
    <CardPage className="space-y-4" data-testid="not-found">
      <p className="text-sm font-bold uppercase tracking-widest text-ink-mute">Nothing at this address</p>
      <h1 className="text-2xl">Page not found</h1>
      <p>
        The link may be mistyped or out of date, or the page has moved. A boat&apos;s tag that no longer opens may have
        been replaced: ask the boat&apos;s team or the chief scrutineer.
      </p>
      <ul className="flex flex-wrap gap-3">
        <li>
          <Link href="/home" className="btn-primary">
            Your home page
          </Link>
        </li>
        <li>
          <Link href="/" className="btn-secondary">
            Boreline’s front page
          </Link>
        </li>
      </ul>
    </CardPage>
  );
}
