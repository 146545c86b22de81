import 'server-only';
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { type Actor } from '@/lib/server/auth/actor';
import { rolesCan, type Role } from '@/lib/core/auth/permissions';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { getObjectBytes } from '@/lib/server/storage/objects';

export type DocumentDownload = {
  fileName: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  bytes: Uint8Array;
};

const notFound = () => new AppError('not_found', 404, 'No such document.');

/**
 * A boat document's bytes for its owner, or for officials ('entry.view_all') of an event the boat
 * is entered in. Both conditions sit inside the query; anyone else gets 404, as for a missing id.
 */
export async function getDocumentForDownload(actor: Actor | null, documentId: string): Promise<DocumentDownload> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  let id: string;
  try {
    id = parseId(documentId, 'document');
  } catch {
    throw notFound();
  }
  const staffEventIds = Object.entries(actor.eventRoles)
    .filter(([, roles]) => rolesCan(roles as Role[], 'entry.view_all'))
    .map(([eventId]) => eventId);
  const rows = await getDb().sequelize.query<{
    objectKey: string;
    fileName: string;
    contentType: string;
    sizeBytes: string;
    sha256: string;
  }>(
    `select d.object_key as "objectKey", d.file_name as "fileName", d.content_type as "contentType",
            d.size_bytes as "sizeBytes", d.sha256
       from boat_documents d join boats b on b.id = d.boat_id
      where d.id = :id
        and (b.owner_id = :uid
             or exists (select 1 from entries e where e.boat_id = b.id and e.event_id = any(array[:events]::uuid[])))`,
    {
      replacements: { id, uid: actor.id, events: staffEventIds.length ? staffEventIds : [null] },
      type: QueryTypes.SELECT,
    },
  );
  const doc = rows[0];
  if (!doc) throw notFound();
  const bytes = await getObjectBytes(doc.objectKey);
  // Hash-checked on the way out: a changed object is never served as the uploaded document.
  if (createHash('sha256').update(bytes).digest('hex') !== doc.sha256) {
    console.error('[boreline] boat document hash mismatch', id);
    throw new AppError(
      'integrity_failed',
      500,
      'This document no longer matches what was uploaded; tell the organiser.',
    );
  }
  return {
    fileName: doc.fileName,
    contentType: doc.contentType,
    sizeBytes: Number(doc.sizeBytes),
    sha256: doc.sha256,
    bytes,
  };
}
