import 'server-only';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { parseId } from '@/lib/server/http/ids';
import { loadRequirements } from './crew-data';

/** The licence grades a class accepts (its own row) and the meeting's default, for the organiser's class page. */
export async function getCrewRequirements(actor: Actor | null, eventId: string, classId: string) {
  const id = parseId(eventId, 'meeting');
  assertCan(actor, 'class.edit', { eventId: id });
  const reqs = await loadRequirements(id);
  return {
    own: reqs.classes.find((c) => c.classId === classId) ?? null,
    meeting: reqs.meeting,
    inForce: reqs.forClass(classId),
  };
}
