import 'server-only';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { listReinspectionViews, type ReinspectionView } from './reinspection-view';

/** The meeting's re-inspection tasks (open first), for those who work through them or set them. */
export async function listReinspections(
  actor: Actor | null,
  eventId: string,
  opts: { openOnly?: boolean } = {},
): Promise<ReinspectionView[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  // Scrutineers and organisers see them on the board; stewards set them without seeing the board.
  if (!can(actor, 'inspection.board', { eventId }) && !can(actor, 'inspection.assign_reinspection', { eventId })) {
    throw new AppError('forbidden', 403, 'You are not allowed to do this.');
  }
  return listReinspectionViews({ eventId, openOnly: opts.openOnly });
}
