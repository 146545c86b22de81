import type { Metadata } from 'next';
import Link from '@/components/link';
import { getEventForOrganiser } from '@/lib/server/events/save-event';
import { listEventClasses, listCopyableClasses } from '@/lib/server/classes/manage-classes';
import { openMeeting } from '../access';
import { EventForm } from '../../event-form';
import { NewClassForm } from '../new-class-form';
import { InviteStaffForm } from '../../../invite-staff-form';
import { PumpCatalogueForm } from '../pump-catalogue-form';
import { listPumpCatalogue } from '@/lib/server/boats/list-pump-catalogue';

export const metadata: Metadata = { title: 'Meeting' };

export default async function EventPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId } = await openMeeting(params);
  const [event, classes, copyable, catalogue] = await Promise.all([
    getEventForOrganiser(actor, eventId),
    listEventClasses(actor, eventId),
    listCopyableClasses(actor, eventId),
    listPumpCatalogue(actor, eventId),
  ]);
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/organise">Organise</Link> / {event.name}
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>{event.name}</h1>
        <div className="flex flex-wrap gap-2">
          <Link href={`/organise/events/${event.id}/entries`} className="btn-primary">
            Entries
          </Link>
          <Link href={`/inspect/${event.id}/board`} className="btn-secondary">
            Inspection board
          </Link>
          <Link href={`/organise/events/${event.id}/results`} className="btn-secondary">
            Provisional results
          </Link>
          <Link href={`/organise/events/${event.id}/penalties`} className="btn-secondary">
            Penalty catalogue
          </Link>
          <Link href={`/organise/events/${event.id}/timing`} className="btn-secondary">
            Run times
          </Link>
          <Link href={`/organise/events/${event.id}/clock`} className="btn-secondary">
            Model against the clock
          </Link>
          <Link href={`/stewards/${event.id}/audit`} className="btn-secondary">
            Audit trail
          </Link>
          <Link href={`/inspect/${event.id}/custody`} className="btn-secondary">
            Parts in custody
          </Link>
          <a href={`/api/events/${event.id}/tag-sheet?sheet=a4-2x7`} className="btn-secondary">
            Tag sheet (A4)
          </a>
          <a href={`/api/events/${event.id}/tag-sheet?sheet=letter-2x5`} className="btn-secondary">
            Tag sheet (Letter)
          </a>
        </div>
      </div>

      <section aria-labelledby="classes" className="card space-y-4">
        <h2 id="classes">Classes and rules</h2>
        {classes.length === 0 ? (
          <p>No classes yet.</p>
        ) : (
          <ul className="divide-y divide-paper-line">
            {classes.map((c) => (
              <li key={c.id} className="flex flex-wrap items-center justify-between gap-2 py-3">
                <Link href={`/organise/events/${event.id}/classes/${c.id}`} className="text-lg font-bold">
                  {c.code} · {c.name}
                </Link>
                <span className="text-sm">
                  {c.publishedVersion && (
                    <Link href={`/organise/events/${event.id}/classes/${c.id}/report`} className="mr-2 font-bold">
                      Parity report
                    </Link>
                  )}
                  {c.publishedVersion ? `rules v${c.publishedVersion} published` : 'rules not published'}
                  {c.latestStatus === 'draft' && ` · draft v${c.latestVersion} open`}
                </span>
              </li>
            ))}
          </ul>
        )}
        <NewClassForm eventId={event.id} copyable={copyable} />
      </section>

      <section aria-labelledby="pump-catalogue" className="card space-y-4">
        <h2 id="pump-catalogue">Pump catalogue</h2>
        <p className="text-ink-soft">
          Impeller models and trims with the maker&apos;s curve, entered once for every entrant: a boat that chooses one
          can be reported on the matched model where its class chose it.
        </p>
        {catalogue.length === 0 ? (
          <p>No impellers yet.</p>
        ) : (
          <ul className="divide-y divide-paper-line" data-testid="pump-catalogue">
            {catalogue.map((c) => (
              <li key={c.id} className="py-2">
                {c.maker} {c.model}
                {c.trimCode && ` trim ${c.trimCode}`} · <span className="figure">{c.impellerDiameterMm} mm</span> ·{' '}
                {c.curve.length} points
              </li>
            ))}
          </ul>
        )}
        <PumpCatalogueForm eventId={event.id} />
      </section>

      <section aria-labelledby="details" className="card space-y-4">
        <h2 id="details">Meeting details</h2>
        <EventForm event={event} />
      </section>

      <section aria-labelledby="staff" className="card space-y-3">
        <h2 id="staff">Staff</h2>
        <p>
          The staff list is on the <Link href="/organise">Organise</Link> page.
        </p>
        <InviteStaffForm eventId={event.id} />
      </section>
    </div>
  );
}
