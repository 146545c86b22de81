import type { Metadata } from 'next';
import Link from '@/components/link';
import { notFound } from 'next/navigation';
import { formatTime } from '@/lib/core/format/time';
import { getEventTimeZone } from '@/lib/server/events/event-heading';
import { findPublishedReport, findPreviousReport } from '@/lib/server/reports/manage-reports';
import { diffReports } from '@/lib/core/reports/report-diff';
import { ParityReport } from '@/components/parity-report';
import { ModelAssumptions } from '@/components/parity-tables';
import { SafetyNote } from '@/components/safety-note';
import { ClockSection } from '@/components/clock-section';
import { reportCheckpoint } from '@/lib/server/chain/chain-service';
import { CheckpointCard } from '@/components/checkpoint-card';

export const dynamic = 'force-dynamic';

export async function generateMetadata({ params }: { params: Promise<{ publicId: string }> }): Promise<Metadata> {
  const report = await findPublishedReport((await params).publicId);
  return { title: report ? `${report.inputs.classCode} parity v${report.number}` : 'Report not found' };
}

// Public, shareable page of one published parity report version (no sign-in).
export default async function PublicReportPage({ params }: { params: Promise<{ publicId: string }> }) {
  const report = await findPublishedReport((await params).publicId);
  if (!report) notFound();
  const previous = await findPreviousReport(report);
  const timeZone = await getEventTimeZone(report.eventId);
  const diff = previous ? diffReports(previous, report) : null;
  const checkpoint = await reportCheckpoint(report.eventId, report.id);
  return (
    <article className="space-y-6">
      <header className="space-y-2">
        <p className="text-sm font-bold uppercase tracking-widest text-flare-600">
          Class parity report · version {report.number}
        </p>
        <h1 data-testid="report-title">
          {report.inputs.className} ({report.inputs.classCode})
        </h1>
        <p className="text-ink-soft">
          {report.inputs.eventName} · published{' '}
          <span data-testid="report-published">{formatTime(report.publishedAt, timeZone)}</span> · class rules version{' '}
          {report.inputs.ruleVersion.version}
        </p>
        {report.note && <p className="rounded-lg bg-tide-50 p-3">{report.note}</p>}
        <div className="flex flex-wrap gap-2">
          <a href={`/api/reports/${report.publicId}/pdf`} className="btn-primary" data-testid="report-pdf">
            Download PDF
          </a>
          <a href={`/api/reports/${report.publicId}/csv`} className="btn-secondary" data-testid="report-csv">
            Download CSV
          </a>
        </div>
        {report.versions.length > 1 && (
          <p className="text-sm">
            Versions:{' '}
            {report.versions.map((v) => (
              <span key={v.number} className="mr-2">
                {v.number === report.number ? (
                  <strong>v{v.number}</strong>
                ) : (
                  <Link href={`/reports/${v.publicId}`}>v{v.number}</Link>
                )}
              </span>
            ))}
          </p>
        )}
      </header>
      <SafetyNote />
      {diff && (
        <section className="card" aria-labelledby="changes">
          <h2 id="changes" className="text-xl">
            Since version {previous!.number}
          </h2>
          <p className="mt-1">
            Spread {diff.spreadBeforePercent?.toFixed(2) ?? '—'} % →{' '}
            <strong>{diff.spreadAfterPercent?.toFixed(2) ?? '—'} %</strong>
            {diff.ruleVersionChanged && ' · class rules changed'}
          </p>
          {diff.boats.length === 0 ? (
            <p>No boat&apos;s figures changed.</p>
          ) : (
            <ul className="mt-2 space-y-1 text-sm" data-testid="report-changes">
              {diff.boats.map((b) => (
                <li key={b.entryId}>
                  {b.label}:{' '}
                  {b.change === 'added'
                    ? 'now included'
                    : b.change === 'removed'
                      ? 'no longer included'
                      : `static thrust ${b.staticThrustBeforeN?.toFixed(0)} → ${b.staticThrustAfterN?.toFixed(0)} N (nozzle ${b.nozzleBeforeMm?.toFixed(2)} → ${b.nozzleAfterMm?.toFixed(2)} mm)`}
                </li>
              ))}
            </ul>
          )}
        </section>
      )}
      <ParityReport inputs={report.inputs} results={report.results} />
      <ModelAssumptions inputs={report.inputs} />
      {report.results.clock && (
        <ClockSection
          section={{ ...report.results.clock, classCode: report.inputs.classCode, className: report.inputs.className }}
          withLevers={false}
        />
      )}
      {checkpoint && (
        <CheckpointCard checkpoint={checkpoint} timeZone={timeZone} testId="report-checkpoint" headingId="checkpoint" />
      )}
    </article>
  );
}
