import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { inspectUpload, PHOTO_TYPES, type InspectedUpload } from '@/lib/server/storage/inspect-upload';
import { newObjectKey, putObject } from '@/lib/server/storage/objects';
import { INSPECTION_PHOTO_MAX_BYTES } from '@/lib/core/inputs/inspections';

export type InspectionPhotoView = {
  id: string;
  inspectionId: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  createdAt: string;
};

/**
 * Attaches photos to a stored inspection. Every photo is checked (size, then type from its bytes)
 * before any is stored; bytes go to object storage before the row, so no row points at nothing.
 * The same photo sent twice (a retry from the dock's offline queue) is stored once, by SHA-256.
 */
export async function addInspectionPhotos(
  actor: Actor | null,
  eventId: string,
  inspectionId: string,
  photos: { bytes: Uint8Array; declaredName: string }[],
): Promise<InspectionPhotoView[]> {
  assertCan(actor, 'inspection.record', { eventId });
  const { models } = getDb();
  const inspection = await models.Inspection.findOne({
    where: { id: inspectionId, eventId },
    attributes: ['id', 'entryId', 'boatId'],
  });
  if (!inspection) throw new AppError('not_found', 404, 'No such inspection at this meeting.');
  const [entry, boat] = await Promise.all([
    models.Entry.findByPk(inspection.entryId, { attributes: ['entrantId'] }),
    models.Boat.findByPk(inspection.boatId, { attributes: ['ownerId'] }),
  ]);
  if (entry?.entrantId === actor.id || boat?.ownerId === actor.id)
    throw new AppError('own_boat', 403, 'You cannot add evidence to the inspection of a boat you entered or own.');

  const checked: { photo: (typeof photos)[number]; file: InspectedUpload }[] = photos.map((photo, i) => {
    try {
      return {
        photo,
        file: inspectUpload({
          bytes: photo.bytes,
          declaredName: photo.declaredName,
          allowed: PHOTO_TYPES,
          maxBytes: INSPECTION_PHOTO_MAX_BYTES,
        }),
      };
    } catch (err) {
      // Name the field, so the form shows the refusal beside the photo input.
      if (err instanceof AppError)
        throw new AppError(err.code, err.status, err.message, [
          { field: 'photo', message: photos.length > 1 ? `Photo ${i + 1}: ${err.message}` : err.message },
        ]);
      throw err;
    }
  });
  const out: InspectionPhotoView[] = [];
  for (const { photo, file } of checked) {
    const existing = await models.InspectionPhoto.findOne({ where: { inspectionId, sha256: file.sha256Hex } });
    const row =
      existing ??
      (await (async () => {
        const objectKey = newObjectKey('inspection-photos');
        await putObject({
          key: objectKey,
          bytes: photo.bytes,
          contentType: file.detectedType,
          metadata: { inspectionId, uploadedById: actor.id },
          sha256Hex: file.sha256Hex,
        });
        return models.InspectionPhoto.create({
          inspectionId,
          objectKey,
          contentType: file.detectedType,
          sizeBytes: file.sizeBytes,
          sha256: file.sha256Hex,
        });
      })());
    out.push({
      id: row.id,
      inspectionId,
      contentType: row.contentType,
      sizeBytes: row.sizeBytes,
      sha256: row.sha256,
      createdAt: row.createdAt.toISOString(),
    });
  }
  return out;
}
