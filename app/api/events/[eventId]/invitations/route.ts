// POST /api/events/:eventId/invitations: an organiser invites a person to the event's staff.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { inviteStaff } from '@/lib/server/auth/invitations';
import { parseId } from '@/lib/server/http/ids';

export const POST = actorHandler<{ eventId: string }>(async (req, { params, actor }) => {
  const invitation = await inviteStaff(actor, parseId(params.eventId, 'event'), await readJson(req));
  return Response.json({ data: invitation }, { status: 201 });
});
