// GET|POST /api/events/:eventId/results: read the provisional results per class; publish a new version (JSON from the form, or a CSV file).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { assertCan } from '@/lib/server/auth/actor';
import { listProvisionalResults } from '@/lib/server/results/list-provisional-results';
import { publishProvisionalResults } from '@/lib/server/results/publish-provisional-results';
import { parseResultsCsv } from '@/lib/core/results/parse-results-csv';
import { RESULTS_CSV_MAX_BYTES } from '@/lib/core/inputs/results';
import { readMultipartUpload } from '@/lib/server/http/read-body';

type P = { eventId: string };

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listProvisionalResults(actor, parseId(params.eventId, 'event')) });
});

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  if (!/^multipart\/form-data/i.test(req.headers.get('content-type') ?? '')) {
    return Response.json(
      { data: await publishProvisionalResults(actor, eventId, await readJson(req), 'form') },
      { status: 201 },
    );
  }
  assertCan(actor, 'results.publish', { eventId }); // before reading an upload at all
  const form = await readMultipartUpload(req, RESULTS_CSV_MAX_BYTES + 16 * 1024, '256 KB');
  const file = form.get('file');
  if (!(file instanceof File) || file.size === 0)
    throw new AppError('invalid_input', 400, 'file: choose a CSV file.', [
      { field: 'file', message: 'Choose a CSV file.' },
    ]);
  const rows = parseResultsCsv(new TextDecoder('utf-8').decode(await file.arrayBuffer()));
  const input = { classId: form.get('classId'), rows, note: String(form.get('note') ?? '') };
  return Response.json({ data: await publishProvisionalResults(actor, eventId, input, 'csv') }, { status: 201 });
});
