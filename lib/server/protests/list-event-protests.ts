import 'server-only';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { queryProtestSummaries, type ProtestSummary } from './protest-view';
import { listMyProtests } from './list-my-protests';

/** A meeting's protests: all of them for its stewards and organiser, otherwise only the caller's own. */
export async function listEventProtests(
  actor: Actor | null,
  eventId: string,
): Promise<{ scope: 'all' | 'own'; items: ProtestSummary[] }> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  if (can(actor, 'protest.view_all', { eventId }))
    return { scope: 'all', items: await queryProtestSummaries('p.event_id = :eventId', { eventId }) };
  return { scope: 'own', items: await listMyProtests(actor, { eventId }) };
}
