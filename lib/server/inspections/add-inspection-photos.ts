import 'server-only';
import { sealKeySql } from '@/lib/server/seals/seal-key';
import { sealNumberKey } from '@/lib/core/inputs/seals';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { inspectPhotos } from '@/lib/server/storage/inspect-upload';
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
  opts: { sealNumber?: string | null } = {},
): Promise<InspectionPhotoView[]> {
  assertCan(actor, 'inspection.record', { eventId });
  const { models, sequelize } = getDb();
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

  // A photo of a seal names a seal this inspection recorded (applied, checked or removed): one photo per upload.
  let sealEvent: { id: string; photoId: string | null } | null = null;
  if (opts.sealNumber) {
    const refuseSeal = (message: string) =>
      new AppError('invalid_input', 400, `sealNumber: ${message}`, [{ field: 'sealNumber', message }]);
    if (photos.length !== 1) throw refuseSeal('Send one photo of the seal at a time.');
    [sealEvent] = await sequelize.query<{ id: string; photoId: string | null }>(
      `select e.id, e.photo_id as "photoId" from seal_events e join seals s on s.id = e.seal_id
        where e.inspection_id = :inspectionId and ${sealKeySql('s.number')} = :key order by e.created_at desc, e.id desc limit 1`,
      { replacements: { inspectionId, key: sealNumberKey(opts.sealNumber) }, type: QueryTypes.SELECT },
    );
    if (!sealEvent) throw refuseSeal(`Seal ${opts.sealNumber} was not recorded in this inspection.`);
  }
  const checked = inspectPhotos(photos, INSPECTION_PHOTO_MAX_BYTES);
  if (sealEvent?.photoId) {
    // A retry of the same photo is answered as before; another photo for the same seal is refused.
    const earlier = await models.InspectionPhoto.findByPk(sealEvent.photoId, { attributes: ['sha256'] });
    if (earlier?.sha256 !== checked[0].file.sha256Hex)
      throw new AppError('seal_photo_taken', 409, `Seal ${opts.sealNumber} already has its photo in this inspection.`);
  }
  const store = async ({ photo, file }: (typeof checked)[number], transaction?: Transaction) => {
    const existing = await models.InspectionPhoto.findOne({
      where: { inspectionId, sha256: file.sha256Hex },
      transaction,
    });
    if (existing) return existing;
    const objectKey = newObjectKey('inspection-photos');
    await putObject({
      key: objectKey,
      bytes: photo.bytes,
      contentType: file.detectedType,
      metadata: { inspectionId, uploadedById: actor.id },
      sha256Hex: file.sha256Hex,
    });
    return models.InspectionPhoto.create(
      {
        inspectionId,
        objectKey,
        contentType: file.detectedType,
        sizeBytes: file.sizeBytes,
        sha256: file.sha256Hex,
      },
      { transaction },
    );
  };
  const view = (row: Awaited<ReturnType<typeof store>>): InspectionPhotoView => ({
    id: row.id,
    inspectionId,
    contentType: row.contentType,
    sizeBytes: row.sizeBytes,
    sha256: row.sha256,
    createdAt: row.createdAt.toISOString(),
  });
  if (sealEvent) {
    // The seal's photo, under the seal event's row lock: of photos sent at once for one seal, the first
    // becomes its photo and the others are refused as a second photo would be, one after another
    // (attack finding F12); a retry of the same photo is answered as before.
    const eventId = sealEvent.id;
    const row = await sequelize.transaction(async (transaction) => {
      const [locked] = await sequelize.query<{ photoId: string | null }>(
        'select photo_id as "photoId" from seal_events where id = :id for update',
        { replacements: { id: eventId }, type: QueryTypes.SELECT, transaction },
      );
      if (locked?.photoId) {
        const earlier = await models.InspectionPhoto.findByPk(locked.photoId, { attributes: ['sha256'], transaction });
        if (earlier?.sha256 !== checked[0].file.sha256Hex)
          throw new AppError(
            'seal_photo_taken',
            409,
            `Seal ${opts.sealNumber} already has its photo in this inspection.`,
          );
      }
      const stored = await store(checked[0], transaction);
      // seal_events allows exactly this one change: its photo, once, from this inspection (migration 20261203005300).
      if (!locked?.photoId)
        await sequelize.query('update seal_events set photo_id = :photoId where id = :id and photo_id is null', {
          replacements: { photoId: stored.id, id: eventId },
          transaction,
        });
      return stored;
    });
    return [view(row)];
  }
  const out: InspectionPhotoView[] = [];
  for (const c of checked) out.push(view(await store(c)));
  return out;
}
