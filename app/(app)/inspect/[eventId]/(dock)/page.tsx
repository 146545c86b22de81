import type { Metadata } from 'next';
import Link from '@/components/link';
import { can, type Actor } from '@/lib/server/auth/actor';
import { listInstruments } from '@/lib/server/inspections/list-instruments';
import { findEntryByRaceNumber } from '@/lib/server/inspections/find-entry-by-race-number';
import { findBoatByTag } from '@/lib/server/inspections/find-boat-by-tag';
import { parseTagScan } from '@/lib/core/tags/parse-tag-scan';
import type { BoatCard } from '@/lib/server/inspections/load-boat-card';
import { AppError } from '@/lib/core/errors';
import { logger } from '@/lib/server/observability';
import { openDock } from '../access';
import { DockScreen } from '../dock-screen';

export const metadata: Metadata = { title: 'Dock inspection' };
export const dynamic = 'force-dynamic';

/**
 * Opened for one boat (?race= from the board's links, ?tag= from a tag scanned with the phone's own camera): the card
 * and its form come in the page's first HTML, not after the scripts, a lookup and the form's code have all arrived
 * (on a phone on one bar, seconds later). The API's own lookups, so the same permission check. A number or tag that
 * finds no boat here, or a card this person may not open, gives null: the screen looks again and says why.
 */
async function lookUpCard(actor: Actor, eventId: string, race?: string, tag?: string) {
  const token = !race && tag ? parseTagScan(tag) : null;
  const lookup = race
    ? findEntryByRaceNumber(actor, eventId, race)
    : token
      ? findBoatByTag(actor, eventId, token)
      : null;
  if (!lookup) return null;
  return lookup.then(
    // The lookup's answer as the API gives it (JSON: instants as strings), so the screen reads one shape.
    (card) => JSON.parse(JSON.stringify(card)) as BoatCard,
    (err: unknown) => {
      // Anything else (the database gone a moment) is logged, and the dock still opens: the screen looks up itself
      // and falls back to the phone's copy, as it did before the card came with the page.
      if (!(err instanceof AppError && err.status < 500))
        logger().error({ err: String(err), eventId }, 'dock page: the boat card lookup failed; the screen will look');
      return null;
    },
  );
}

// The dock screen for scrutineers of this meeting; it keeps working offline once visited.
export default async function DockPage({
  params,
  searchParams,
}: {
  params: Promise<{ eventId: string }>;
  searchParams: Promise<{ race?: string | string[]; tag?: string | string[] }>;
}) {
  const { actor, eventId, event } = await openDock(params);
  // The first of a repeated word, as the screen's own URLSearchParams.get reads it.
  const query = await searchParams;
  const [race, tag] = [query.race, query.tag].map((v) => (Array.isArray(v) ? v[0] : v));
  const [instruments, initialCard] = await Promise.all([
    listInstruments(actor, eventId),
    lookUpCard(actor, eventId, race, tag),
  ]);
  return (
    <div className="space-y-4 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        <Link href="/inspect">Inspect</Link> / {event.name}
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Dock inspection</h1>
        <div className="flex flex-wrap gap-2">
          <Link href={`/inspect/${eventId}/board`} className="btn-secondary text-lg">
            Inspection board
          </Link>
          <Link href={`/inspect/${eventId}/custody`} className="btn-secondary text-lg">
            Parts in custody
          </Link>
          <Link href={`/inspect/${eventId}/instruments`} className="btn-secondary text-lg">
            Instruments
          </Link>
          <Link href={`/inspect/${eventId}/seals`} className="btn-secondary text-lg">
            Seals
          </Link>
        </div>
      </div>
      <DockScreen
        eventId={eventId}
        actorId={actor.id}
        instruments={instruments}
        canOpenLogbook={can(actor, 'entry.view_all', { eventId })}
        opensFromLink={Boolean(race || tag)}
        initialCard={initialCard}
      />
    </div>
  );
}
