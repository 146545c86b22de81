import type { Metadata } from 'next';
import Link from '@/components/link';
import { notFound } from 'next/navigation';
import { formatTime } from '@/lib/core/format/time';
import { AppError } from '@/lib/core/errors';
import { computeDraftReport, listReportVersions } from '@/lib/server/reports/manage-reports';
import { ParityReport } from '@/components/parity-report';
import { ModelAssumptions } from '@/components/parity-tables';
import { SafetyNote } from '@/components/safety-note';
import { ClockSection } from '@/components/clock-section';
import { openClassReport } from '../../../access';
import { PublishReportForm } from './publish-report-form';
import { WhatIfSandbox } from './what-if-sandbox';
import { ClockLink } from '@/components/clock-link';

export const metadata: Metadata = { title: 'Parity report (draft)' };

export default async function DraftReportPage({ params }: { params: Promise<{ eventId: string; classId: string }> }) {
  const { actor, eventId, classId, cls } = await openClassReport(params);
  let draft;
  try {
    draft = await computeDraftReport(actor, eventId, classId);
  } catch (err) {
    if (err instanceof AppError && err.status === 404) notFound();
    if (err instanceof AppError && err.status === 409) {
      return (
        <div className="card space-y-2">
          <h1>Parity report</h1>
          <p>{err.message}</p>
          <Link href={`/organise/events/${eventId}/classes/${classId}`}>Publish the class rules first</Link>
        </div>
      );
    }
    throw err;
  }
  const versions = await listReportVersions(actor, eventId, classId);
  const inForce = cls.versions.find((v) => v.id === draft.inputs.ruleVersion.id)!;
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/organise">Organise</Link> / <Link href={`/organise/events/${eventId}`}>Meeting</Link> /{' '}
        <Link href={`/organise/events/${eventId}/classes/${classId}`}>{draft.inputs.classCode}</Link> / Parity report
      </nav>
      <h1 data-testid="draft-heading">
        Parity report draft · {draft.inputs.classCode} {draft.inputs.className}
      </h1>
      <p className="rounded-lg bg-doubt-100 p-3">
        This draft is computed from the latest inspections each time the page loads. Nothing is public until you publish
        a version.
      </p>
      <SafetyNote />
      <ParityReport inputs={draft.inputs} results={draft.results} />
      <ModelAssumptions inputs={draft.inputs} />
      {draft.results.clock && (
        <ClockSection
          section={{ ...draft.results.clock, classCode: draft.inputs.classCode, className: draft.inputs.className }}
          withLevers={false}
        />
      )}
      <WhatIfSandbox eventId={eventId} classId={classId} inputs={draft.inputs} rules={inForce.rules} />
      <ClockLink eventId={eventId} classId={classId} />
      <section className="card space-y-3" aria-labelledby="publish">
        <h2 id="publish" className="text-xl">
          Publish
        </h2>
        <PublishReportForm
          eventId={eventId}
          classId={classId}
          nextNumber={(versions[0]?.number ?? 0) + 1}
          canPublish={draft.inputs.boats.length > 0}
        />
        {versions.length > 0 && (
          <ul className="space-y-1" data-testid="published-versions">
            {versions.map((v) => (
              <li key={v.id}>
                <Link href={`/reports/${v.publicId}`}>Version {v.number}</Link> ·{' '}
                {formatTime(v.publishedAt, cls.timeZone)}
                {v.note && ` · ${v.note}`}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
