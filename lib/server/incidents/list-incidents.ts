import 'server-only';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { readIncidents, type IncidentView } from './incident-view';

/** The meeting's incidents, newest first, corrections included (each says whether it is current). */
export async function listIncidents(actor: Actor | null, eventId: string): Promise<IncidentView[]> {
  assertCan(actor, 'incident.view', { eventId });
  return readIncidents({ eventId });
}
