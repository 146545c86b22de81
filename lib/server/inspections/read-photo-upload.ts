import 'server-only';
import { AppError } from '@/lib/core/errors';
import { readFormBody } from '@/lib/server/http/read-body';
import { INSPECTION_PHOTO_MAX_BYTES, INSPECTION_PHOTOS_PER_UPLOAD } from '@/lib/core/inputs/inspections';
import { sealNumber as sealNumberSchema } from '@/lib/core/inputs/seals';

// One photo at the limit plus room for the multipart boundaries. The dock sends one photo per
// request: this keeps every upload under the 10 MB that Next.js buffers for the proxy (a larger
// body would reach the handler cut short), and a retry resends only the photo that failed.
export const PHOTO_UPLOAD_MAX_BODY_BYTES = INSPECTION_PHOTO_MAX_BYTES + 64 * 1024;
const MB = INSPECTION_PHOTO_MAX_BYTES / (1024 * 1024);

/**
 * The photos of a multipart upload (field "photo", repeated), read through the one capped body
 * reader (lib/server/http/read-body.ts): refused by a declared Content-Length before a byte is read, and
 * while streaming once past the cap, so a request that sends no length cannot get past it either.
 */
export async function readPhotoUpload(
  req: Request,
): Promise<{ photos: { bytes: Uint8Array; declaredName: string }[]; sealNumber: string | null }> {
  const form = await readFormBody(req, PHOTO_UPLOAD_MAX_BODY_BYTES, {
    field: 'photo',
    wrongType: 'Send the photos as multipart/form-data in the field "photo".',
    wrongTypeField: 'Send the photos as a form upload.',
    tooLarge: `The upload is too large: a photo may be up to ${MB} MB.`,
    tooLargeField: `A photo may be up to ${MB} MB: take it again at a lower resolution.`,
    unreadable: 'photo: the upload could not be read as a form.',
  });
  const files = form.getAll('photo').filter((f): f is File => f instanceof File && f.size > 0);
  if (files.length === 0)
    throw new AppError('invalid_input', 400, 'photo: choose a photo to upload.', [
      { field: 'photo', message: 'Choose a photo to upload.' },
    ]);
  if (files.length > INSPECTION_PHOTOS_PER_UPLOAD) {
    throw new AppError('invalid_input', 400, `photo: send at most ${INSPECTION_PHOTOS_PER_UPLOAD} photos at once.`, [
      { field: 'photo', message: `Send at most ${INSPECTION_PHOTOS_PER_UPLOAD} photos at once.` },
    ]);
  }
  // Optional: the seal this photo shows (a seal applied, checked or removed in the same inspection).
  const seal = form.get('sealNumber');
  let sealNumber: string | null = null;
  if (typeof seal === 'string' && seal.trim() !== '') {
    const parsed = sealNumberSchema.safeParse(seal);
    if (!parsed.success)
      throw new AppError('invalid_input', 400, `sealNumber: ${parsed.error.issues[0].message}`, [
        { field: 'sealNumber', message: parsed.error.issues[0].message },
      ]);
    sealNumber = parsed.data;
  }
  const photos = await Promise.all(
    files.map(async (f) => ({ bytes: new Uint8Array(await f.arrayBuffer()), declaredName: f.name })),
  );
  return { photos, sealNumber };
}
