// POST|GET /api/protests/:protestId/evidence: add evidence (multipart "file", or JSON note / inspection link); list it with integrity.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { AppError } from '@/lib/core/errors';
import { addEvidence } from '@/lib/server/protests/add-evidence';
import { listEvidence } from '@/lib/server/protests/list-evidence';
import { findProtestForActor } from '@/lib/server/protests/find-protest-for-actor';
import { readMultipartUpload } from '@/lib/server/http/read-body';
import { EVIDENCE_MAX_BYTES } from '@/lib/core/protests/protest-states';

type P = { protestId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  if (!/^multipart\/form-data/i.test(req.headers.get('content-type') ?? '')) {
    return Response.json({ data: await addEvidence(actor, params.protestId, await readJson(req)) }, { status: 201 });
  }
  await findProtestForActor(actor, params.protestId); // 404 before reading an upload for a protest the caller cannot see
  // Room for the multipart boundaries around a file at the limit.
  const form = await readMultipartUpload(req, EVIDENCE_MAX_BYTES + 64 * 1024, '40 MB');
  const file = form.get('file');
  if (!(file instanceof File) || file.size === 0)
    throw new AppError('invalid_input', 400, 'file: choose a file to upload.', [
      { field: 'file', message: 'Choose a file to upload.' },
    ]);
  const data = await addEvidence(actor, params.protestId, {
    kind: 'file',
    bytes: new Uint8Array(await file.arrayBuffer()),
    declaredName: file.name,
  });
  return Response.json({ data }, { status: 201 });
});

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await listEvidence(actor, params.protestId) });
});
