// POST /api/events/:eventId/staff: give a registered person a staff role, or invite them by e-mail.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { assertCan } from '@/lib/server/auth/actor';
import { parseId } from '@/lib/server/http/ids';
import { assignStaff } from '@/lib/server/events/assign-staff';

export const POST = actorHandler<{ eventId: string }>(async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  assertCan(actor, 'event.staff_manage', { eventId }); // before reading a body at all
  const result = await assignStaff(actor, eventId, await readJson(req));
  return Response.json({ data: result }, { status: 201 });
});
