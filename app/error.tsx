'use client';

import Link from '@/components/link';
import { CardPage } from '@/components/card-page';

// Shown when a page outside the signed-in sections fails, or the signed-in shell itself does:
// a plain message and a retry, never the error (the detail stays in the server's log).
export default function RootError({ retry }: { error: unknown; retry: () => void }) {
  return (
    <CardPage>
      <div role="alert" className="space-y-4" data-testid="root-error">
        <h1 className="text-2xl">This page could not be loaded</h1>
        <p>
          Something went wrong on our side or the connection dropped. Nothing you saved is lost: try again, or come back
          in a minute.
        </p>
        <ul className="flex flex-wrap gap-3">
          <li>
            <button type="button" className="btn-primary" onClick={retry}>
              Try again
            </button>
          </li>
          <li>
            <Link href="/" className="btn-secondary">
              Boreline’s front page
            </Link>
          </li>
        </ul>
      </div>
    </CardPage>
  );
}
