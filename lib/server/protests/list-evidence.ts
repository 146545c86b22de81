import 'server-only';
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { AppError } from '@/lib/core/errors';
import { getObjectBytes } from '@/lib/server/storage/objects';
import type { Actor } from '@/lib/server/auth/actor';
import { findProtestForActor } from './find-protest-for-actor';

export type Integrity = 'intact' | 'altered' | 'missing';
export type EvidenceView = {
  id: string;
  kind: 'file' | 'inspection_link' | 'note';
  addedByName: string;
  createdAt: string;
  fileName: string | null;
  contentType: string | null;
  sizeBytes: number | null;
  sha256: string | null;
  integrity: Integrity | null; // files only: the stored bytes hashed again now
  inspectionId: string | null;
  inspectionLabel: string | null;
  note: string | null;
};

/** Recomputes a stored object's SHA-256 and compares it with the one recorded at upload. */
export async function checkStoredHash(
  objectKey: string,
  sha256: string,
): Promise<{ integrity: Integrity; bytes: Buffer | null; sha256Now: string | null }> {
  try {
    const bytes = await getObjectBytes(objectKey);
    const sha256Now = createHash('sha256').update(bytes).digest('hex');
    return { integrity: sha256Now === sha256 ? 'intact' : 'altered', bytes, sha256Now };
  } catch (err) {
    if (err instanceof AppError && err.status === 404) return { integrity: 'missing', bytes: null, sha256Now: null };
    throw err;
  }
}

type Row = Omit<EvidenceView, 'integrity' | 'createdAt' | 'sizeBytes'> & {
  createdAt: Date;
  sizeBytes: string | null;
  objectKey: string | null;
};

/** A protest's evidence, oldest first, each file's hash checked against the stored bytes. */
export async function listEvidence(
  actor: Actor | null,
  protestId: string,
  opts: { verify?: boolean } = {},
): Promise<EvidenceView[]> {
  const { protest } = await findProtestForActor(actor, protestId);
  const rows = await getDb().sequelize.query<Row>(
    `select x.id, x.kind, coalesce(u.name, u.email) as "addedByName", x.created_at as "createdAt", x.file_name as "fileName",
            x.content_type as "contentType", x.size_bytes as "sizeBytes", x.sha256, x.object_key as "objectKey",
            x.inspection_id as "inspectionId", x.note,
            case when i.id is null then null else
              concat(replace(i.kind, '_', '-'), ' inspection, ', replace(i.overall_result, '_', ' '), ', recorded ', to_char(i.received_at at time zone 'UTC', 'YYYY-MM-DD HH24:MI'), ' UTC') end as "inspectionLabel"
       from protest_evidence x join users u on u.id = x.added_by_id left join inspections i on i.id = x.inspection_id
      where x.protest_id = :protestId order by x.created_at, x.id`,
    { replacements: { protestId: protest.id }, type: QueryTypes.SELECT },
  );
  return Promise.all(
    rows.map(async ({ objectKey, ...r }) => ({
      ...r,
      createdAt: new Date(r.createdAt).toISOString(),
      sizeBytes: r.sizeBytes === null ? null : Number(r.sizeBytes),
      integrity:
        r.kind === 'file' && opts.verify !== false && objectKey && r.sha256
          ? (await checkStoredHash(objectKey, r.sha256)).integrity
          : null,
    })),
  );
}
