import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { inspectPhotos } from '@/lib/server/storage/inspect-upload';
import { newObjectKey, putObject } from '@/lib/server/storage/objects';
import { INSPECTION_PHOTO_MAX_BYTES } from '@/lib/core/inputs/inspections';

export type IncidentPhotoView = {
  id: string;
  incidentId: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
};

/**
 * Photos of an incident, stored as the dock stores an inspection's (lib/server/inspections/add-inspection-photos.ts):
 * each photo's size and type (from its bytes) checked before any is stored, bytes in object storage before
 * the row, and the same photo sent twice stored once (by SHA-256). The rows are append-only.
 */
export async function addIncidentPhotos(
  actor: Actor | null,
  eventId: string,
  incidentId: string,
  photos: { bytes: Uint8Array; declaredName: string }[],
): Promise<IncidentPhotoView[]> {
  assertCan(actor, 'incident.record', { eventId });
  const { models } = getDb();
  const incident = await models.Incident.findOne({ where: { id: incidentId, eventId }, attributes: ['id', 'entryId'] });
  if (!incident) throw new AppError('not_found', 404, 'No such incident at this meeting.');
  // As for recording the incident: nobody adds evidence about a boat they entered or own.
  const entry = await models.Entry.findByPk(incident.entryId, { attributes: ['entrantId', 'boatId'] });
  const boat = entry && (await models.Boat.findByPk(entry.boatId, { attributes: ['ownerId'] }));
  if (entry?.entrantId === actor.id || boat?.ownerId === actor.id)
    throw new AppError('own_boat', 403, 'You cannot add photos to an incident of a boat you entered or own.');
  const checked = inspectPhotos(photos, INSPECTION_PHOTO_MAX_BYTES);
  const out: IncidentPhotoView[] = [];
  for (const { photo, file } of checked) {
    let row = await models.IncidentPhoto.findOne({ where: { incidentId, sha256: file.sha256Hex } });
    if (!row) {
      const objectKey = newObjectKey('incident-photos');
      await putObject({
        key: objectKey,
        bytes: photo.bytes,
        contentType: file.detectedType,
        metadata: { incidentId, uploadedById: actor.id },
        sha256Hex: file.sha256Hex,
      });
      [row] = await models.IncidentPhoto.findOrCreate({
        where: { incidentId, sha256: file.sha256Hex },
        defaults: {
          incidentId,
          objectKey,
          contentType: file.detectedType,
          sizeBytes: file.sizeBytes,
          sha256: file.sha256Hex,
          uploadedById: actor.id,
        },
      });
    }
    out.push({
      id: row.id,
      incidentId,
      contentType: row.contentType,
      sizeBytes: Number(row.sizeBytes),
      sha256: row.sha256,
    });
  }
  return out;
}
