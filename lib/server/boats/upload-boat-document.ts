import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { BOAT_DOCUMENT_MAX_BYTES, UploadDocumentFields } from '@/lib/core/inputs/boats';
import { inspectUpload, DOCUMENT_TYPES } from '@/lib/server/storage/inspect-upload';
import { newObjectKey, putObject } from '@/lib/server/storage/objects';
import { findOwnBoat, toDocumentView, type BoatDocumentView } from './boat-view';

export type DocumentUpload = { bytes: Uint8Array; declaredName: string; kind: unknown };

/**
 * Stores a document for the owner's boat. The type is detected from the bytes (a text file named
 * .pdf is refused with 415) and the size capped (413), both before anything is stored. The bytes
 * go to object storage first, so a database row never points at a missing object.
 */
export async function uploadBoatDocument(
  actor: Actor | null,
  boatId: string,
  upload: DocumentUpload,
): Promise<BoatDocumentView> {
  assertCan(actor, 'boat.manage_own');
  const boat = await findOwnBoat(actor, boatId);
  const { kind } = UploadDocumentFields.parse({ kind: upload.kind });
  const file = await inspectUpload({
    bytes: upload.bytes,
    declaredName: upload.declaredName,
    allowed: DOCUMENT_TYPES,
    maxBytes: BOAT_DOCUMENT_MAX_BYTES,
  });
  const objectKey = newObjectKey('boat-documents');
  await putObject({
    key: objectKey,
    bytes: upload.bytes,
    contentType: file.detectedType,
    metadata: { boatId: boat.id, uploadedById: actor.id },
    sha256Hex: file.sha256Hex,
  });
  const doc = await getDb().models.BoatDocument.create({
    boatId: boat.id,
    uploadedById: actor.id,
    kind,
    objectKey,
    fileName: file.safeName,
    contentType: file.detectedType,
    sizeBytes: file.sizeBytes,
    sha256: file.sha256Hex,
  });
  return toDocumentView(doc);
}
