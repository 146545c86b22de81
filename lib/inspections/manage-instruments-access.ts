import 'server-only';
import { can, type Actor } from '@/lib/auth/actor';
import { AppError } from '@/lib/http/errors';
import type { Permission } from '@/lib/auth/permissions';

/**
 * Who may add and retire a meeting's instruments: the organiser (event.edit, as before) and the
 * chief scrutineer, who prepares the dock's kit with the tags (tags.print: the same two roles).
 * The table has no instrument permission of its own yet; this pair is named once, here.
 */
export const MANAGE_INSTRUMENTS: readonly Permission[] = ['event.edit', 'tags.print'];

export function canManageInstruments(actor: Actor | null, eventId: string): boolean {
  return MANAGE_INSTRUMENTS.some((p) => can(actor, p, { eventId }));
}

export function assertCanManageInstruments(actor: Actor | null, eventId: string): asserts actor is Actor {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  if (!canManageInstruments(actor, eventId)) throw new AppError('forbidden', 403, 'You are not allowed to do this.');
}
