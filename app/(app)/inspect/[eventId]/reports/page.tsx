import type { Metadata } from 'next';
import Link from '@/components/link';
import { getReportDesk } from '@/lib/server/penalties/technical-reports';
import { GOVERNING_BODY_CAUTION } from '@/lib/core/penalties/penalty-kinds';
import { formatInZone } from '@/lib/core/protests/protest-window';
import { SafetyNote } from '@/components/safety-note';
import { openReports } from '../access';
import { ReportForm } from './report-form';

export const metadata: Metadata = { title: 'Reports to the stewards' };
export const dynamic = 'force-dynamic';

export default async function ReportsPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId, event } = await openReports(params);
  const desk = await getReportDesk(actor, eventId);
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/inspect">Inspect</Link> / <Link href={`/inspect/${eventId}`}>{event.name}</Link> / Reports to the
        stewards
      </nav>
      <h1>Reports to the stewards at {event.name}</h1>
      <SafetyNote />
      <p className="text-sm text-ink-soft" data-testid="governing-body-caution">
        {GOVERNING_BODY_CAUTION}
      </p>
      <p>
        A report is no decision: the stewards decide on it, with a penalty or none, and the meeting&apos;s stewards are
        told by e-mail.
      </p>
      <ReportForm eventId={eventId} entries={Object.fromEntries(desk.entries.map((e) => [e.id, e.label]))} />
      <section aria-labelledby="filed" className="space-y-2">
        <h2 id="filed">Reports filed ({desk.reports.length})</h2>
        {desk.reports.length === 0 && <p className="text-ink-soft">No reports.</p>}
        <ul className="space-y-2">
          {desk.reports.map((r) => (
            <li key={r.id} className="card">
              <p className="font-bold">
                #{r.raceNumber} {r.boatName}: {r.ruleReference}
              </p>
              <p className="whitespace-pre-line">{r.facts}</p>
              <p className="text-sm text-ink-soft">
                by {r.filedByName}, {formatInZone(r.createdAt, event.timeZone)}
                {r.penaltyIds.length ? ' · decided with a penalty' : ''}
              </p>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
