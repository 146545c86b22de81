import Link from '@/components/link';

// What a section of the signed-in area shows in place of its page: while it loads, when what the
// address names does not exist, and when it failed. Inside the area's layout (which has the <main>),
// so a card rather than a whole page (the root's own boundaries use CardPage).

/** A skeleton in the page's outline, announced once to screen readers. */
export function SectionLoading({ label }: { label: string }) {
  return (
    <div className="space-y-4" aria-busy="true" data-testid="section-loading">
      <p role="status" className="sr-only">
        {label}
      </p>
      <div className="h-9 w-56 max-w-full animate-pulse rounded-lg bg-paper-deep" />
      <div className="card h-28 animate-pulse bg-paper-deep" />
      <div className="card h-28 animate-pulse bg-paper-deep" />
    </div>
  );
}

/** Nothing at this address in the section, with the way back to the section's first page. */
export function SectionNotFound({
  title,
  children,
  backHref,
  backLabel,
}: {
  title: string;
  children: React.ReactNode;
  backHref: string;
  backLabel: string;
}) {
  return (
    <div className="card space-y-3" data-testid="section-not-found">
      <h1 className="text-2xl">{title}</h1>
      <p>{children}</p>
      <Link href={backHref} className="btn-primary">
        {backLabel}
      </Link>
    </div>
  );
}

/**
 * A section that failed: a plain message and a retry, never the error itself (in production Next
 * sends a client only a digest of a server error; the detail stays in the server's log).
 */
export function SectionError({ title, retry }: { title: string; retry: () => void }) {
  return (
    <div role="alert" className="card space-y-3" data-testid="section-error">
      <h1 className="text-2xl">{title}</h1>
      <p>
        Something went wrong on our side or the connection dropped. Nothing you saved is lost: try again, or come back
        in a minute.
      </p>
      <button type="button" className="btn-primary" onClick={retry}>
        Try again
      </button>
    </div>
  );
}
