import 'server-only';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { readPenalties, type PenaltyView } from './penalty-view';

/**
 * A meeting's penalties: decisions posted for everyone at the meeting, like its results, so anyone signed in
 * reads them (the reasons are the stewards' published words; evidence stays with the protest).
 */
export async function listPenalties(actor: Actor | null, eventId: string): Promise<PenaltyView[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  if (!(await getDb().models.Event.findByPk(eventId, { attributes: ['id'] })))
    throw new AppError('not_found', 404, 'No such meeting.');
  return readPenalties({ eventId });
}
