import type { Metadata } from 'next';
import Link from '@/components/link';
import { openAudit } from '../access';
import { AuditQuery, listAuditEvents } from '@/lib/server/audit/list-audit-events';
import { AUDIT_KINDS, AUDIT_KIND_LABELS, type AuditKind } from '@/lib/core/audit/describe-audit-event';
import { formatTime } from '@/lib/core/format/time';
import { SafetyNote } from '@/components/safety-note';

export const metadata: Metadata = { title: 'Audit trail' };
export const dynamic = 'force-dynamic';

// Read-only: the trail is written by the changes it records and the database refuses edits.
export default async function AuditPage({
  params,
  searchParams,
}: {
  params: Promise<{ eventId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { actor, eventId, event } = await openAudit(params);
  const sp = await searchParams;
  const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
  // A hand-edited or stale "?before=" or "?kind=" shows the newest page of everything with a note, never an error page.
  const before = AuditQuery.shape.before.safeParse(one(sp.before));
  const kindParsed = AuditQuery.shape.kind.safeParse(one(sp.kind) || undefined);
  const kind: AuditKind | undefined = kindParsed.success ? kindParsed.data : undefined;
  const page = await listAuditEvents(actor, eventId, { before: before.success ? before.data : undefined, kind });
  const href = (k?: AuditKind, cursor?: string) => {
    const q = new URLSearchParams();
    if (k) q.set('kind', k);
    if (cursor) q.set('before', cursor);
    const s = q.toString();
    return s ? `?${s}` : '?';
  };
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/stewards">Stewards</Link> / <Link href={`/stewards/${eventId}`}>{event.name}</Link> / Audit trail
      </nav>
      <h1>Audit trail</h1>
      <p className="text-ink-soft">
        Everything recorded at this meeting, newest first: protests, results, inspections, class rules, parts in custody
        and staff. Times are in the meeting&apos;s zone, {event.timeZone}; money in {event.currency}. Nothing here can
        be edited or deleted.
      </p>
      <SafetyNote />
      <nav aria-label="Show only" className="flex flex-wrap gap-2" data-testid="audit-kinds">
        <Link href={href()} className={kind ? 'btn-secondary' : 'btn-primary'} aria-current={kind ? undefined : 'page'}>
          Everything
        </Link>
        {AUDIT_KINDS.map((k) => (
          <Link
            key={k}
            href={href(k)}
            className={kind === k ? 'btn-primary' : 'btn-secondary'}
            aria-current={kind === k ? 'page' : undefined}
          >
            {AUDIT_KIND_LABELS[k]}
          </Link>
        ))}
      </nav>
      {(!before.success || !kindParsed.success) && (
        <p role="status" className="rounded-lg border-l-8 border-doubt-600 bg-doubt-100 p-4 text-doubt-800">
          The address asked for a page or a kind of the trail that does not exist; this is the newest page
          {kind ? '' : ' of everything'}.
        </p>
      )}
      {page.items.length === 0 ? (
        <p className="card text-ink-soft" data-testid="audit-empty">
          {kind
            ? `Nothing of this kind (${AUDIT_KIND_LABELS[kind].toLowerCase()}) has been recorded at this meeting yet.`
            : 'Nothing has been recorded at this meeting yet: protests, decisions, inspections and published results appear here as they happen.'}
        </p>
      ) : (
        <ol className="space-y-3" data-testid="audit-trail">
          {page.items.map((a) => (
            <li key={a.id} className="card space-y-2" data-action={a.action} data-kind={a.kind}>
              <p className="text-sm text-ink-mute">
                <time dateTime={a.at}>{formatTime(a.at, page.timeZone)}</time> ·{' '}
                {AUDIT_KIND_LABELS[a.kind as AuditKind] ?? a.kind}
              </p>
              <p className="text-lg" data-testid="audit-sentence">
                {a.segments.map((s, i) =>
                  s.href ? (
                    <Link key={i} href={s.href}>
                      {s.text}
                    </Link>
                  ) : (
                    <span key={i}>{s.text}</span>
                  ),
                )}
              </p>
              <details className="text-sm">
                <summary className="cursor-pointer text-ink-soft">Recorded detail</summary>
                <dl className="mt-2 grid gap-x-3 gap-y-1 sm:grid-cols-[10rem_1fr]">
                  <dt className="text-ink-soft">Code</dt>
                  <dd>
                    <code>{a.action}</code>
                  </dd>
                  <dt className="text-ink-soft">Instant (UTC)</dt>
                  <dd>
                    <code>{a.at}</code>
                  </dd>
                  <dt className="text-ink-soft">Subject</dt>
                  <dd>
                    <code className="break-all">
                      {a.kind} {a.subjectId}
                    </code>
                  </dd>
                  <dt className="text-ink-soft">Details</dt>
                  <dd>
                    <code className="figure break-all text-xs">{JSON.stringify(a.details)}</code>
                  </dd>
                </dl>
              </details>
            </li>
          ))}
        </ol>
      )}
      {page.nextBefore && (
        <Link href={href(kind, page.nextBefore)} className="btn-secondary">
          Older
        </Link>
      )}
    </div>
  );
}
