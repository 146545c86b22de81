// GET, POST /api/events/:eventId/interests: the meeting's register of declared interests (an official's own; stewards and organiser see all) and a new declaration; append-only (PUT, PATCH, DELETE: 405).
import { withPermission, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listInterestRegister } from '@/lib/server/interests/list-interest-register';
import { declareInterest } from '@/lib/server/interests/declare-interest';

export const GET = withPermission<{ eventId: string }>('interest.declare', async (_req, { actor, params }) => {
  return Response.json({ data: await listInterestRegister(actor, parseId(params.eventId, 'meeting')) });
});

export const POST = withPermission<{ eventId: string }>('interest.declare', async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'meeting');
  return Response.json(
    { data: await declareInterest(actor, eventId, await readJson(req, 16 * 1024)) },
    { status: 201 },
  );
});

// A declaration is never edited or removed: it is withdrawn with a second record (…/withdraw).
const appendOnly = async () =>
  Response.json(
    { error: { code: 'method_not_allowed', message: 'Declarations are append-only: withdraw one instead.' } },
    { status: 405, headers: { allow: 'GET, HEAD, POST' } },
  );
export { appendOnly as PUT, appendOnly as PATCH, appendOnly as DELETE };
