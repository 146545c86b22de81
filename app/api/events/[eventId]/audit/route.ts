// GET /api/events/:eventId/audit: the meeting's audit trail, read-only (no method writes it: 405).
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listAuditEvents } from '@/lib/server/audit/list-audit-events';

export const GET = actorHandler<{ eventId: string }>(async (req, { actor, params }) => {
  const query = Object.fromEntries(req.nextUrl.searchParams);
  return Response.json({ data: await listAuditEvents(actor, parseId(params.eventId, 'event'), query) });
});

// The trail is written only as a side effect of the changes it records, never through a route.
const readOnly = async () =>
  Response.json(
    { error: { code: 'method_not_allowed', message: 'The audit trail is read-only.' } },
    { status: 405, headers: { allow: 'GET, HEAD' } },
  );
export { readOnly as POST, readOnly as PUT, readOnly as PATCH, readOnly as DELETE };
