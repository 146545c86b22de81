import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import type { Protest } from '@/models';
import { describeConflict, findProtestConflicts } from '@/lib/server/interests/find-protest-conflicts';

export type ProtestAccess = {
  protest: Protest;
  isLodger: boolean;
  isProtested: boolean; // the entrant of the protested entry, once the protest is lodged
  isOfficial: boolean; // 'protest.view_all' at the meeting (stewards, organiser)
  canDecide: boolean; // 'protest.decide' at the meeting (stewards only)
};

const notFound = () => new AppError('not_found', 404, 'No such protest.');

/**
 * The protest with what the person may do with it. Only the parties and the meeting's officials
 * learn that it exists: anyone else gets 404, as for a missing id. The protested entrant is a
 * party only once the fee is paid (until then nothing has been lodged against them).
 */
export async function findProtestForActor(
  actor: Actor | null,
  protestId: string,
  opts: { transaction?: Transaction; lock?: boolean } = {},
): Promise<ProtestAccess> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const id = parseId(protestId, 'protest');
  const { models } = getDb();
  const protest = await models.Protest.findByPk(id, {
    transaction: opts.transaction,
    ...(opts.lock && opts.transaction && { lock: opts.transaction.LOCK.UPDATE }),
  });
  if (!protest) throw notFound();
  const scope = { eventId: protest.eventId };
  const isLodger = protest.lodgedById === actor.id;
  let isProtested = false;
  if (protest.againstEntryId && protest.status !== 'awaiting_fee') {
    const entry = await models.Entry.findByPk(protest.againstEntryId, {
      attributes: ['entrantId'],
      transaction: opts.transaction,
    });
    isProtested = entry?.entrantId === actor.id;
  }
  const isOfficial = can(actor, 'protest.view_all', scope);
  if (!isLodger && !isProtested && !isOfficial) throw notFound();
  return { protest, isLodger, isProtested, isOfficial, canDecide: can(actor, 'protest.decide', scope) };
}

/**
 * For steps only the meeting's stewards take (accept, reject, re-inspection, hearing, decision): a
 * party or the organiser who can see it gets 403, and so does a steward with an interest in it
 * (lib/server/interests/find-protest-conflicts.ts): the role alone is not enough.
 */
export async function findProtestForSteward(
  actor: Actor | null,
  protestId: string,
  transaction: Transaction,
): Promise<ProtestAccess> {
  const access = await findProtestForActor(actor, protestId, { transaction, lock: true });
  if (!access.canDecide) throw new AppError('forbidden', 403, 'Only the stewards of this meeting can do this.');
  const [conflict] = await findProtestConflicts(access.protest.id, [actor!.id], transaction);
  if (conflict) {
    const why = conflict.reasons.map((r) => describeConflict(r)).join('; ');
    throw new AppError(
      'conflict_of_interest',
      403,
      `You have an interest in this protest (${why}): another steward of this meeting must accept, hear and decide it.`,
    );
  }
  return access;
}
