// POST /api/boats/:boatId/documents: the owner uploads a document (multipart fields "file" and "kind", up to 10 MB).
import { actorHandler } from '@/lib/server/http/handler';
import { AppError } from '@/lib/core/errors';
import { readFormBody } from '@/lib/server/http/read-body';
import { uploadBoatDocument } from '@/lib/server/boats/upload-boat-document';
import { BOAT_DOCUMENT_MAX_BYTES } from '@/lib/core/inputs/boats';
import { findOwnBoat } from '@/lib/server/boats/boat-view';

// Room for the multipart boundaries and the "kind" field around a file at the limit.
const MAX_BODY_BYTES = BOAT_DOCUMENT_MAX_BYTES + 64 * 1024;

export const POST = actorHandler<{ boatId: string }>(async (req, { actor, params }) => {
  // Ownership first: nobody learns anything about another person's boat from how an upload fails.
  await findOwnBoat(actor, params.boatId);
  // The one capped reader: a declared length over the cap is refused before a byte is read, and
  // a body without one is cancelled the moment it passes the cap.
  const form = await readFormBody(req, MAX_BODY_BYTES, {
    field: 'file',
    wrongType: 'Send the document as multipart/form-data with the file in the field "file".',
    tooLarge: 'The file is larger than 10 MB: upload a smaller copy (a scan at 150 dpi is plenty).',
    tooLargeField: 'The file is larger than 10 MB.',
    unreadable: 'The upload could not be read as a form.',
  });
  const file = form.get('file');
  if (!(file instanceof File) || file.size === 0) {
    throw new AppError('invalid_input', 400, 'file: choose a file to upload.', [
      { field: 'file', message: 'Choose a file to upload.' },
    ]);
  }
  const doc = await uploadBoatDocument(actor, params.boatId, {
    bytes: new Uint8Array(await file.arrayBuffer()),
    declaredName: file.name,
    kind: form.get('kind') ?? 'other',
  });
  return Response.json({ data: doc }, { status: 201 });
});
