import 'server-only';
import { getDb } from '@/lib/server/db';
import { fieldError } from '@/lib/core/errors';
import { can, type Actor } from '@/lib/server/auth/actor';
import { DeclarePerformanceInput } from '@/lib/core/inputs/boat-performance';
import type { StoredBoatPerformance } from '@/lib/core/boats/declared-performance';
import type { StoredDeclaredPump } from '@/models/shapes/boat-performance';
import { updateBoat } from './update-boat';
import type { BoatView } from './boat-view';

/**
 * Sets the actor's own boat's declared engine curve, pump characteristic and suction data (the whole
 * set; a part sent as null or left out is cleared). It is part of the declaration: a change is a new
 * version, and a boat inspected against an earlier one is flagged for re-inspection (updateBoat). A
 * pump chosen from a meeting's catalogue is stored with a copy of the catalogue's curve as it is now.
 * The owner check comes before the body is read (updateBoat).
 */
export async function declarePerformance(
  actor: Actor | null,
  boatId: string,
  readInput: () => Promise<unknown>,
): Promise<BoatView> {
  return updateBoat(actor, boatId, readInput, async (raw) => {
    const input = DeclarePerformanceInput.parse(raw);
    let pump: StoredDeclaredPump | null = null;
    if (input.pump?.kind === 'catalogue') {
      const { models } = getDb();
      const entry = await models.PumpCatalogueEntry.findByPk(input.pump.catalogueEntryId);
      // A draft meeting's catalogue is not public yet: chosen by id it is as unknown as in the list.
      const event = entry && (await models.Event.findByPk(entry.eventId, { attributes: ['id', 'status'] }));
      const isVisible = !!event && (event.status !== 'draft' || can(actor!, 'class.edit', { eventId: event.id }));
      if (!entry || !isVisible)
        throw fieldError('pump.catalogueEntryId', 'No such impeller in the catalogue: choose one from the list.');
      pump = {
        kind: 'catalogue',
        catalogueEntryId: entry.id,
        maker: entry.maker,
        model: entry.model,
        trimCode: entry.trimCode,
        impellerDiameterMm: entry.impellerDiameterMm,
        curve: entry.curve,
      };
    } else if (input.pump) pump = input.pump;
    const declared: StoredBoatPerformance = { engine: input.engine, pump, suction: input.suction };
    return {
      declaredPerformance: declared.engine || declared.pump || declared.suction ? declared : null,
    };
  });
}
