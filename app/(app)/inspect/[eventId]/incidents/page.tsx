import type { Metadata } from 'next';
import Link from '@/components/link';
import { openIncidents } from '../access';
import { loadIncidentsPage } from '@/lib/server/incidents/load-incidents-page';
import { formatTime } from '@/lib/core/format/time';
import { SafetyNote } from '@/components/safety-note';
import { IncidentForm } from './incident-form';

export const metadata: Metadata = { title: 'Incidents' };
export const dynamic = 'force-dynamic';

// Incidents at the meeting: recorded by the organiser or the chief scrutineer, never edited (a correction is a
// new record). Damage makes a re-inspection mandatory before the boat's next run.
export default async function IncidentsPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId, event } = await openIncidents(params);
  const page = await loadIncidentsPage(actor, eventId);
  const entries = page.entries.map((e) => ({ id: e.id, label: `no. ${e.raceNumber} ${e.boatName} (${e.classCode})` }));
  return (
    <div className="space-y-5 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        <Link href="/inspect">Inspect</Link> / {event.name} / Incidents
      </nav>
      <h1>Incidents</h1>
      <SafetyNote />
      {page.canRecord && entries.length > 0 && (
        <IncidentForm eventId={eventId} timeZone={event.timeZone} entries={entries} />
      )}
      <section aria-labelledby="incident-list-heading" className="space-y-3">
        <h2 id="incident-list-heading" className="text-xl">
          Recorded ({page.incidents.filter((i) => i.isCurrent).length})
        </h2>
        {page.incidents.length === 0 && <p className="card text-ink-soft">No incidents have been recorded.</p>}
        <ul className="space-y-3" data-testid="incident-list">
          {page.incidents.map((i) => (
            <li key={i.id} className={`card space-y-1 ${i.isCurrent ? '' : 'opacity-80'}`} data-incident={i.id}>
              <p className="font-bold">
                <span className="figure">no. {i.raceNumber}</span> {i.boatName} · {i.classCode} ·{' '}
                {formatTime(i.occurredAt, event.timeZone)}
              </p>
              <p className="whitespace-pre-line">{i.description}</p>
              {i.damage && (
                <p className="text-base" data-testid="incident-reinspection">
                  <strong>Damage:</strong>{' '}
                  {i.reinspection?.doneAt
                    ? `re-inspected ${formatTime(i.reinspection.doneAt, event.timeZone)}`
                    : 'must be inspected again before its next run (on the board).'}
                </p>
              )}
              {i.photos.length > 0 && <p className="text-base">{i.photos.length} photo(s) stored</p>}
              {i.supersedesId && <p className="text-base">Correction: {i.correctionReason}</p>}
              <p className="text-base text-ink-soft">
                Recorded by {i.recordedBy}, {formatTime(i.createdAt, event.timeZone)}
                {i.isCurrent ? '' : ' · replaced by a correction'}
              </p>
              {page.canRecord && i.isCurrent && (
                <details>
                  <summary className="cursor-pointer text-base">Correct this record</summary>
                  <IncidentForm
                    eventId={eventId}
                    timeZone={event.timeZone}
                    entries={[]}
                    correcting={{ id: i.id, entryId: i.entryId, label: `no. ${i.raceNumber} ${i.boatName}` }}
                  />
                </details>
              )}
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
