// GET|POST /api/events/:eventId/run-times: a meeting's current run times per class; store runs from a timing CSV file (multipart) or typed on the form (JSON).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { assertCan } from '@/lib/server/auth/actor';
import { listRunTimes } from '@/lib/server/timing/list-run-times';
import { importRunTimesCsv, recordRunTimesForm } from '@/lib/server/timing/record-run-times';
import { readRunTimesUpload } from '@/lib/server/timing/read-run-times-upload';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listRunTimes(actor, parseId(params.eventId, 'event')) });
});

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  assertCan(actor, 'results.publish', { eventId }); // before reading a body at all
  const outcome = /^multipart\/form-data/i.test(req.headers.get('content-type') ?? '')
    ? await (async () => {
        const { fields, text } = await readRunTimesUpload(req);
        return importRunTimesCsv(actor, eventId, fields, text);
      })()
    : await recordRunTimesForm(actor, eventId, await readJson(req, 64 * 1024));
  return Response.json({ data: outcome }, { status: outcome.stored + outcome.corrected > 0 ? 201 : 200 });
});
