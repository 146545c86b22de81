import 'server-only';
import { literal, UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, can, type Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { OPEN_STATUSES, PROTEST_STATUS_LABELS, type ProtestStatus } from '@/lib/core/protests/protest-states';
import { ReleaseFromCustodyInput, TakeIntoCustodyInput } from '@/lib/core/inputs/custody';
import { loadCustodyViews, type CustodyItemView } from './custody-view';

/** The meeting's parts in custody (held first), for the officials who work with them. */
export async function listCustody(actor: Actor | null, eventId: string): Promise<CustodyItemView[]> {
  assertCan(actor, 'custody.view', { eventId });
  return loadCustodyViews({ eventId });
}

/**
 * The meeting's open protests a part can be kept for, worded for a list; empty for those who may
 * not see the meeting's protests (scrutineers take parts without naming one).
 */
export async function listProtestsToKeepPartsFor(
  actor: Actor | null,
  eventId: string,
): Promise<{ id: string; label: string }[]> {
  if (!can(actor, 'protest.view_all', { eventId })) return [];
  const protests = await getDb().models.Protest.findAll({
    where: { eventId, status: [...OPEN_STATUSES] },
    attributes: ['id', 'ruleReference', 'status'],
    order: [['createdAt', 'ASC']],
  });
  return protests.map((p) => ({
    id: p.id,
    label: `${p.ruleReference} (${PROTEST_STATUS_LABELS[p.status as ProtestStatus].toLowerCase()})`,
  }));
}

/** Parts kept for one protest, for the meeting's officials who hear it. */
export async function listCustodyForProtest(
  actor: Actor | null,
  eventId: string,
  protestId: string,
): Promise<CustodyItemView[]> {
  assertCan(actor, 'custody.view', { eventId });
  return loadCustodyViews({ eventId, protestId: parseId(protestId, 'protest') });
}

/**
 * A scrutineer (or steward) takes a part into custody: which boat, what it is, the seal or bag
 * number, and the protest it is kept for, if any. Append-only: a wrong record is released with a note.
 */
export async function takeIntoCustody(actor: Actor | null, eventId: string, raw: unknown): Promise<CustodyItemView> {
  assertCan(actor, 'custody.take', { eventId });
  const input = TakeIntoCustodyInput.parse(raw);
  const { models } = getDb();
  // A boat in several classes has one number and one set of parts: its first live entry holds them.
  const entry = await models.Entry.findOne({
    where: { eventId, raceNumber: input.raceNumber },
    attributes: ['id', 'status'],
    order: [
      [literal(`status in ('awaiting_payment', 'entered')`), 'DESC'],
      ['createdAt', 'ASC'],
    ],
  });
  if (!entry) throw fieldError('raceNumber', `No boat has race number ${input.raceNumber} at this meeting.`);
  if (input.protestId) {
    const protest = await models.Protest.findOne({ where: { id: input.protestId, eventId }, attributes: ['id'] });
    if (!protest) throw fieldError('protestId', 'Choose a protest of this meeting.');
  }
  const item = await models.CustodyItem.create({
    eventId,
    entryId: entry.id,
    protestId: input.protestId,
    description: input.description,
    sealNumber: input.sealNumber,
    takenById: actor.id,
  });
  return (await loadCustodyViews({ eventId, itemId: item.id }))[0];
}

/**
 * The chief scrutineer or a steward releases a part, to whom and why. Refused while a protest it
 * is kept for is still open (parts are held pending protests: common practice), and only once.
 */
export async function releaseFromCustody(
  actor: Actor | null,
  eventId: string,
  itemId: string,
  raw: unknown,
): Promise<CustodyItemView> {
  assertCan(actor, 'custody.release', { eventId });
  const id = parseId(itemId, 'item');
  const input = ReleaseFromCustodyInput.parse(raw);
  const { models, sequelize } = getDb();
  return sequelize.transaction(async (transaction) => {
    const item = await models.CustodyItem.findOne({
      where: { id, eventId },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!item) throw new AppError('not_found', 404, 'No such item in custody.');
    if (item.protestId) {
      const protest = await models.Protest.findByPk(item.protestId, {
        attributes: ['status', 'ruleReference'],
        transaction,
      });
      if (protest && OPEN_STATUSES.includes(protest.status as ProtestStatus)) {
        throw new AppError(
          'protest_pending',
          409,
          `This part is kept for the protest under ${protest.ruleReference}, which is not decided yet.`,
        );
      }
    }
    try {
      await models.CustodyRelease.create(
        { itemId: item.id, releasedById: actor.id, releasedTo: input.releasedTo, note: input.note },
        { transaction },
      );
    } catch (err) {
      if (err instanceof UniqueConstraintError)
        throw new AppError('already_released', 409, 'This part has already been released.');
      throw err;
    }
    return (await loadCustodyViews({ eventId, itemId: item.id, transaction }))[0];
  });
}
