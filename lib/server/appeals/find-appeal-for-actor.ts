import 'server-only';
import type { Transaction } from 'sequelize';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { readAppeal, type AppealRecord } from './appeal-view';

export type AppealAccess = {
  appeal: AppealRecord;
  isAppellant: boolean;
  isParty: boolean; // the appellant, the penalised entrant or the protester (the last two once lodged)
  isMeetingOfficial: boolean; // 'protest.view_all' at the meeting (its stewards and organiser)
  isAppealBody: boolean;
};

const notFound = () => new AppError('not_found', 404, 'No such appeal.');

/**
 * The appeal with what the person may do with it. Only its parties, the meeting's stewards and organiser,
 * and the appeal body learn that it exists; anyone else gets 404, as for a missing id. The other parties
 * see it once it is lodged (until the fee is paid nothing has been lodged).
 */
export async function findAppealForActor(
  actor: Actor | null,
  appealId: string,
  opts: { transaction?: Transaction; lock?: boolean } = {},
): Promise<AppealAccess> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const appeal = await readAppeal(parseId(appealId, 'appeal'), opts);
  if (!appeal) throw notFound();
  const isAppellant = appeal.lodgedById === actor.id;
  const lodged = appeal.status !== 'awaiting_fee';
  const isParty =
    isAppellant ||
    (lodged && [appeal.penalisedEntrantId, appeal.boatOwnerId, appeal.protestLodgerId].includes(actor.id));
  const isMeetingOfficial = can(actor, 'protest.view_all', { eventId: appeal.eventId });
  const isAppealBody = can(actor, 'appeal.hear', { eventId: appeal.eventId });
  if (!isParty && !isMeetingOfficial && !isAppealBody) throw notFound();
  return { appeal, isAppellant, isParty, isMeetingOfficial, isAppealBody };
}

/**
 * For the appeal body's steps (hearing, decision): anyone else who can see the appeal gets 403, and so does a
 * member who is a party to it, or holds any role at the meeting whose decision is appealed: the appeal body
 * hears a meeting's decisions from outside it (common practice, no single source).
 */
export async function findAppealForAppealBody(
  actor: Actor | null,
  appealId: string,
  transaction: Transaction,
): Promise<AppealAccess> {
  const access = await findAppealForActor(actor, appealId, { transaction, lock: true });
  if (!access.isAppealBody) throw new AppError('forbidden', 403, 'Only the appeal body can do this.');
  const a = access.appeal;
  const party = [a.lodgedById, a.penalisedEntrantId, a.boatOwnerId, a.protestLodgerId].includes(actor!.id);
  const official = (actor!.eventRoles[a.eventId] ?? []).length > 0;
  if (party || official)
    throw new AppError(
      'conflict_of_interest',
      403,
      party
        ? 'You are a party to this appeal: another member of the appeal body must hear and decide it.'
        : 'You hold a role at this meeting: another member of the appeal body must hear and decide it.',
    );
  return access;
}
