import 'server-only';
import { assertCan, can, type Actor } from '@/lib/server/auth/actor';

/** Who may add and retire a meeting's instruments: 'instrument.manage' (chief scrutineer, organiser). */
export function canManageInstruments(actor: Actor | null, eventId: string): boolean {
  return can(actor, 'instrument.manage', { eventId });
}

export function assertCanManageInstruments(actor: Actor | null, eventId: string): asserts actor is Actor {
  assertCan(actor, 'instrument.manage', { eventId });
}
