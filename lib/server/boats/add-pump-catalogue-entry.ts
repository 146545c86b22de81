import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { PumpCatalogueEntryInput } from '@/lib/core/inputs/boat-performance';
import { toCatalogueView, type PumpCatalogueView } from './list-pump-catalogue';

/**
 * A meeting's organiser enters a maker's impeller model and trim with its curve, once for every entrant.
 * Entries are append-only (a correction is a new entry; a declaration keeps a copy of the curve it chose).
 * Permission before the body is read.
 */
export async function addPumpCatalogueEntry(
  actor: Actor | null,
  eventId: string,
  readInput: () => Promise<unknown>,
): Promise<PumpCatalogueView> {
  assertCan(actor, 'class.edit', { eventId });
  const { models } = getDb();
  if (!(await models.Event.findByPk(eventId, { attributes: ['id'] })))
    throw new AppError('not_found', 404, 'No such meeting.');
  const input = PumpCatalogueEntryInput.parse(await readInput());
  const entry = await models.PumpCatalogueEntry.create({
    eventId,
    maker: input.maker,
    model: input.model,
    trimCode: input.trimCode,
    impellerDiameterMm: input.impellerDiameterMm,
    curve: input.curve,
    createdById: actor.id,
  });
  const event = (await models.Event.findByPk(eventId, { attributes: ['name', 'organisationId'] }))!;
  const organisation = await models.Organisation.findByPk(event.organisationId, { attributes: ['name'] });
  return toCatalogueView(entry, event.name, organisation?.name ?? '');
}
