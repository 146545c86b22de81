// GET|POST /api/events/:eventId/seal-batches: the meeting's seal batches; the chief scrutineer or organiser issues a numbered batch.
import { withPermission, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listSealBatches } from '@/lib/server/seals/list-seal-batches';
import { issueSealBatch } from '@/lib/server/seals/issue-seal-batch';

type P = { eventId: string };

export const GET = withPermission<P>('inspection.board', async (_req, { actor, params }) => {
  return Response.json({ data: await listSealBatches(actor, parseId(params.eventId, 'event')) });
});

// The permission is checked (by withPermission) before the body is read.
export const POST = withPermission<P>('instrument.manage', async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  return Response.json({ data: await issueSealBatch(actor, eventId, await readJson(req)) }, { status: 201 });
});
