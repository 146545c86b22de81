// POST /api/events/:eventId/invitations: an organiser invites a person to the event's staff.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { assertCan } from '@/lib/server/auth/actor';
import { inviteStaff } from '@/lib/server/auth/invitations';
import { parseId } from '@/lib/server/http/ids';

export const POST = actorHandler<{ eventId: string }>(async (req, { params, actor }) => {
  const eventId = parseId(params.eventId, 'event');
  assertCan(actor, 'event.staff_manage', { eventId }); // before reading a body at all
  const invitation = await inviteStaff(actor, eventId, await readJson(req));
  return Response.json({ data: invitation }, { status: 201 });
});
