import type { Metadata } from 'next';
import Link from '@/components/link';
import { AppError } from '@/lib/core/errors';
import { gatherClockSection, type ClockSectionView } from '@/lib/server/timing/gather-clock-section';
import { listRunTimes } from '@/lib/server/timing/list-run-times';
import { ClockSection } from '@/components/clock-section';
import { SafetyNote } from '@/components/safety-note';
import { ClockEqualisation } from '@/components/clock-equalisation';
import { openResults } from '../access';

export const metadata: Metadata = { title: 'Model against the clock' };
export const dynamic = 'force-dynamic';

export default async function ClockPage({
  params,
  searchParams,
}: {
  params: Promise<{ eventId: string }>;
  searchParams: Promise<{ class?: string }>;
}) {
  const { actor, eventId } = await openResults(params);
  const classes = await listRunTimes(actor, eventId);
  const wanted = (await searchParams).class;
  const chosen = classes.find((c) => c.classId === wanted) ?? classes.find((c) => c.runs.length > 0) ?? classes[0];
  let section: ClockSectionView | null = null;
  let refusal: string | null = null;
  if (chosen) {
    try {
      section = await gatherClockSection(actor, eventId, chosen.classId);
    } catch (err) {
      if (err instanceof AppError && err.status === 409) refusal = err.message;
      else throw err;
    }
  }
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/organise">Organise</Link> / <Link href={`/organise/events/${eventId}`}>Meeting</Link> / Model
        against the clock
      </nav>
      <h1>Model against the clock</h1>
      <p>
        How far the parity model&apos;s predicted runs agree with the run times stored on{' '}
        <Link href={`/organise/events/${eventId}/timing`}>Run times</Link>. A prediction is a model, not a result: the
        class rules and the officials decide, and the clock decides the racing.
      </p>
      {classes.length > 1 && (
        <nav aria-label="Classes" className="flex flex-wrap gap-2">
          {classes.map((c) => (
            <Link
              key={c.classId}
              href={`/organise/events/${eventId}/clock?class=${c.classId}`}
              className={c.classId === chosen?.classId ? 'btn-primary' : 'btn-secondary'}
              aria-current={c.classId === chosen?.classId ? 'page' : undefined}
            >
              {c.classCode} ({c.runs.length} run{c.runs.length === 1 ? '' : 's'})
            </Link>
          ))}
        </nav>
      )}
      {!chosen && <p>This meeting has no classes yet.</p>}
      {refusal && <p className="card">{refusal}</p>}
      {section && <ClockSection section={section} />}
      {section && <ClockEqualisation section={section} />}
      <SafetyNote />
    </div>
  );
}
