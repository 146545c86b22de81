import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { WithdrawInterestInput } from '../../core/inputs/interests';
import { queryInterests, type InterestView } from './interest-view';

/**
 * An official withdraws one of their own declarations, with a reason: a second record, never an
 * edit. Someone else's declaration is 404, as for a missing id. A withdrawal does not clear a
 * conflict for a protest lodged while the interest stood (lib/server/interests/find-protest-conflicts.ts).
 */
export async function withdrawInterest(
  actor: Actor | null,
  eventId: string,
  interestId: string,
  readBody: () => Promise<unknown>,
): Promise<InterestView> {
  assertCan(actor, 'interest.declare', { eventId });
  const id = parseId(interestId, 'declaration');
  const { models } = getDb();
  const interest = await models.OfficialInterest.findOne({ where: { id, eventId, officialId: actor.id } });
  if (!interest) throw new AppError('not_found', 404, 'No such declaration of yours at this meeting.');
  // The body is read only once the declaration is known to be the caller's.
  const input = WithdrawInterestInput.parse(await readBody());
  try {
    await models.OfficialInterestWithdrawal.create({ interestId: id, withdrawnById: actor.id, reason: input.reason });
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw new AppError('already_withdrawn', 409, 'This declaration is already withdrawn.');
    throw err;
  }
  const [view] = await queryInterests(eventId, { interestId: id });
  return view;
}
