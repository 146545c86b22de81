// POST /api/events/:eventId/run-times/preview: what importing a timing CSV file would do, line by line; nothing is stored.
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { assertCan } from '@/lib/server/auth/actor';
import { previewRunTimesCsv } from '@/lib/server/timing/record-run-times';
import { readRunTimesUpload } from '@/lib/server/timing/read-run-times-upload';

type P = { eventId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  assertCan(actor, 'results.publish', { eventId }); // before reading the upload
  const { fields, text } = await readRunTimesUpload(req);
  return Response.json({ data: { lines: await previewRunTimesCsv(actor, eventId, fields, text) } });
});
