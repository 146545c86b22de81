import 'server-only';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { readSlotsWithBookings, type SlotWithBookingsView } from './slot-view';

/** The meeting's slots with who is booked into each: for the officials who run or see the dock. */
export async function listSlots(actor: Actor | null, eventId: string): Promise<SlotWithBookingsView[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  if (!can(actor, 'inspection.board', { eventId }) && !can(actor, 'schedule.manage', { eventId }))
    throw new AppError('forbidden', 403, 'You are not allowed to do this.');
  return readSlotsWithBookings(eventId);
}
