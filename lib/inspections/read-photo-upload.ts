import 'server-only';
import { AppError } from '@/lib/http/errors';
import { INSPECTION_PHOTO_MAX_BYTES, INSPECTION_PHOTOS_PER_UPLOAD } from '@/lib/validations/inspections';

// One photo at the limit plus room for the multipart boundaries. The dock sends one photo per
// request: this keeps every upload under the 10 MB that Next.js buffers for the proxy (a larger
// body would reach the handler cut short), and a retry resends only the photo that failed.
export const PHOTO_UPLOAD_MAX_BODY_BYTES = INSPECTION_PHOTO_MAX_BYTES + 64 * 1024;
const MB = INSPECTION_PHOTO_MAX_BYTES / (1024 * 1024);
const tooLarge = () =>
  new AppError('too_large', 413, `The upload is too large: a photo may be up to ${MB} MB.`, [
    { field: 'photo', message: `A photo may be up to ${MB} MB: take it again at a lower resolution.` },
  ]);

/**
 * The photos of a multipart upload (field "photo", repeated). The declared Content-Length is
 * refused before a byte is read; the body is then read while counting, so a request that lies
 * about its length (or sends none) cannot stream past the limit either.
 */
export async function readPhotoUpload(req: Request): Promise<{ bytes: Uint8Array; declaredName: string }[]> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;/i.test(type)) {
    throw new AppError('unsupported_media_type', 415, 'Send the photos as multipart/form-data in the field "photo".', [{ field: 'photo', message: 'Send the photos as a form upload.' }]);
  }
  const declared = Number(req.headers.get('content-length'));
  if (Number.isFinite(declared) && declared > PHOTO_UPLOAD_MAX_BODY_BYTES) throw tooLarge();
  const reader = req.body?.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    if (!reader) break;
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > PHOTO_UPLOAD_MAX_BODY_BYTES) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  let form: FormData;
  try {
    form = await new Response(Buffer.concat(chunks) as BodyInit, { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('invalid_input', 400, 'photo: the upload could not be read as a form.', [{ field: 'photo', message: 'The upload could not be read; try again.' }]);
  }
  const files = form.getAll('photo').filter((f): f is File => f instanceof File && f.size > 0);
  if (files.length === 0) throw new AppError('invalid_input', 400, 'photo: choose a photo to upload.', [{ field: 'photo', message: 'Choose a photo to upload.' }]);
  if (files.length > INSPECTION_PHOTOS_PER_UPLOAD) {
    throw new AppError('invalid_input', 400, `photo: send at most ${INSPECTION_PHOTOS_PER_UPLOAD} photos at once.`, [{ field: 'photo', message: `Send at most ${INSPECTION_PHOTOS_PER_UPLOAD} photos at once.` }]);
  }
  return Promise.all(files.map(async (f) => ({ bytes: new Uint8Array(await f.arrayBuffer()), declaredName: f.name })));
}
