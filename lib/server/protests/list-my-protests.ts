import 'server-only';
import { AppError } from '@/lib/core/errors';
import type { Actor } from '@/lib/server/auth/actor';
import { queryProtestSummaries, type ProtestSummary } from './protest-view';

/** Protests the person lodged, and those lodged against their entries (once the fee is paid), newest first. */
export async function listMyProtests(actor: Actor | null, opts: { eventId?: string } = {}): Promise<ProtestSummary[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  return queryProtestSummaries(
    `(p.lodged_by_id = :uid or (e.entrant_id = :uid and p.status <> 'awaiting_fee'))${opts.eventId ? ' and p.event_id = :eventId' : ''}`,
    { uid: actor.id, eventId: opts.eventId ?? null },
  );
}
