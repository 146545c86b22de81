// POST /api/events/:eventId/invitations: an organiser invites a person to the event's staff.
import { actorHandler, readJson } from '@/lib/http/handler';
import { inviteStaff } from '@/lib/auth/invitations';
import { InviteStaffInput } from '@/lib/validations/auth';

export const POST = actorHandler<{ eventId: string }>(async (req, { params, actor }) => {
  const input = InviteStaffInput.parse(await readJson(req));
  const invitation = await inviteStaff(actor, params.eventId, input);
  return Response.json({ data: invitation }, { status: 201 });
});
