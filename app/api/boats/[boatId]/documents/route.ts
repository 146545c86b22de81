// POST /api/boats/:boatId/documents: the owner uploads a document (multipart fields "file" and "kind", up to 10 MB).
import { actorHandler } from '@/lib/http/handler';
import { AppError } from '@/lib/http/errors';
import { uploadBoatDocument } from '@/lib/boats/upload-boat-document';
import { BOAT_DOCUMENT_MAX_BYTES } from '@/lib/validations/boats';
import { findOwnBoat } from '@/lib/boats/boat-view';

// Room for the multipart boundaries and the "kind" field around a file at the limit.
const MAX_BODY_BYTES = BOAT_DOCUMENT_MAX_BYTES + 64 * 1024;
const tooLarge = () =>
  new AppError('too_large', 413, 'The file is larger than 10 MB: upload a smaller copy (a scan at 150 dpi is plenty).', [
    { field: 'file', message: 'The file is larger than 10 MB.' },
  ]);

/** Reads the body while counting, so a request without Content-Length cannot stream past the limit. */
async function readCapped(req: Request, maxBytes: number): Promise<Uint8Array> {
  const reader = req.body?.getReader();
  if (!reader) return new Uint8Array();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

export const POST = actorHandler<{ boatId: string }>(async (req, { actor, params }) => {
  // Ownership first: nobody learns anything about another person's boat from how an upload fails.
  await findOwnBoat(actor, params.boatId);
  const type = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;/i.test(type)) {
    throw new AppError('unsupported_media_type', 415, 'Send the document as multipart/form-data with the file in the field "file".', [
      { field: 'file', message: 'Send the file as a form upload.' },
    ]);
  }
  // Refuse by the declared length before reading a single byte of the body.
  const declared = Number(req.headers.get('content-length'));
  if (Number.isFinite(declared) && declared > MAX_BODY_BYTES) throw tooLarge();
  const body = await readCapped(req, MAX_BODY_BYTES);
  let form: FormData;
  try {
    form = await new Response(body as BodyInit, { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('invalid_input', 400, 'The upload could not be read as a form.', [{ field: 'file', message: 'The upload could not be read; try again.' }]);
  }
  const file = form.get('file');
  if (!(file instanceof File) || file.size === 0) {
    throw new AppError('invalid_input', 400, 'file: choose a file to upload.', [{ field: 'file', message: 'Choose a file to upload.' }]);
  }
  const doc = await uploadBoatDocument(actor, params.boatId, {
    bytes: new Uint8Array(await file.arrayBuffer()),
    declaredName: file.name,
    kind: form.get('kind') ?? 'other',
  });
  return Response.json({ data: doc }, { status: 201 });
});
