import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound, redirect } from 'next/navigation';
import { getActor, can } from '@/lib/auth/actor';
import { getDb } from '@/lib/db';
import { parseId } from '@/lib/http/ids';
import { AuditQuery, listAuditEvents } from '@/lib/audit/list-audit-events';
import { formatInZone } from '@/lib/protests/protest-window';

export const metadata: Metadata = { title: 'Audit trail' };
export const dynamic = 'force-dynamic';

// Read-only: the trail is written by the changes it records and the database refuses edits.
export default async function AuditPage({ params, searchParams }: { params: Promise<{ eventId: string }>; searchParams: Promise<Record<string, string | undefined>> }) {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  let eventId: string;
  try { eventId = parseId((await params).eventId, 'event'); } catch { notFound(); }
  if (!can(actor, 'audit.read', { eventId })) redirect('/not-allowed');
  const sp = await searchParams;
  // A hand-edited or stale "?before=" shows the newest page with a note, never an error page.
  const before = AuditQuery.shape.before.safeParse(sp.before);
  const [event, page] = await Promise.all([getDb().models.Event.findByPk(eventId), listAuditEvents(actor, eventId, { before: before.success ? before.data : undefined })]);
  if (!event) notFound();
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm"><Link href="/stewards">Stewards</Link> / <Link href={`/stewards/${eventId}`}>{event.name}</Link> / Audit trail</nav>
      <h1>Audit trail</h1>
      <p className="text-ink-soft">Every change to protests and results at this meeting, newest first. Nothing here can be edited or deleted.</p>
      {!before.success && <p role="status" className="rounded-lg border-l-8 border-doubt-600 bg-doubt-100 p-4 text-doubt-800">The address asked for a page of the trail that does not exist; this is the newest page.</p>}
      {page.items.length === 0 ? (
        <p className="card text-ink-soft" data-testid="audit-empty">Nothing has been recorded at this meeting yet: protests, decisions and published results appear here as they happen.</p>
      ) : (
      <div className="card overflow-x-auto p-0">
        <table className="w-full min-w-[40rem] text-left text-sm" data-testid="audit-table">
          <thead className="bg-paper-deep"><tr><th className="p-2">When ({event.timeZone})</th><th className="p-2">Who</th><th className="p-2">What</th><th className="p-2">Subject</th><th className="p-2">Details</th></tr></thead>
          <tbody>
            {page.items.map((a) => (
              <tr key={a.id} className="border-t border-paper-line align-top" data-action={a.action}>
                <td className="p-2">{formatInZone(a.at, event.timeZone)}</td>
                <td className="p-2">{a.actorName ?? 'payment provider (verified webhook)'}</td>
                <td className="p-2 font-bold">{a.action}</td>
                <td className="p-2">{a.subjectType === 'protest' ? <Link href={`/stewards/${eventId}/protests/${a.subjectId}`}>{a.subjectType} {a.subjectId.slice(0, 8)}</Link> : `${a.subjectType} ${a.subjectId.slice(0, 8)}`}</td>
                <td className="p-2"><code className="figure break-all text-xs">{JSON.stringify(a.details)}</code></td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      )}
      {page.nextBefore && <Link href={`?before=${page.nextBefore}`} className="btn-secondary">Older</Link>}
    </div>
  );
}
