import 'server-only';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { findProtestForActor } from './find-protest-for-actor';
import { checkStoredHash } from './list-evidence';

export type OpenedEvidence = {
  fileName: string;
  contentType: string;
  bytes: Buffer;
  sha256Stored: string;
  sha256Now: string;
  integrity: 'intact' | 'altered';
};

/**
 * Reads an evidence file back from storage and hashes it again: 'intact' when the SHA-256 equals
 * the one stored at upload, 'altered' otherwise. An altered file is still served (the stewards must
 * see what is there) but says so, and the finding goes into the audit trail.
 */
export async function openEvidence(actor: Actor | null, evidenceId: string): Promise<OpenedEvidence> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  const id = parseId(evidenceId, 'evidence');
  const evidence = await getDb().models.ProtestEvidence.findByPk(id);
  if (!evidence) throw new AppError('not_found', 404, 'No such evidence.');
  const { protest } = await findProtestForActor(actor, evidence.protestId).catch((err) => {
    if (err instanceof AppError && err.status === 404) throw new AppError('not_found', 404, 'No such evidence.');
    throw err;
  });
  if (evidence.kind !== 'file' || !evidence.objectKey || !evidence.sha256)
    throw new AppError('not_found', 404, 'This evidence is not a file.');
  const checked = await checkStoredHash(evidence.objectKey, evidence.sha256);
  if (checked.integrity === 'missing' || !checked.bytes)
    throw new AppError('not_found', 404, 'The stored file is missing; tell the stewards.');
  if (checked.integrity === 'altered') {
    console.error('[boreline] evidence hash mismatch', evidence.id);
    await recordAuditEvent({
      eventId: protest.eventId,
      actorId: actor.id,
      subjectType: 'protest',
      subjectId: protest.id,
      action: 'protest.evidence_altered_detected',
      details: { evidenceId: evidence.id, sha256Stored: evidence.sha256, sha256Now: checked.sha256Now },
    });
  }
  return {
    fileName: evidence.fileName ?? 'evidence',
    contentType: evidence.contentType ?? 'application/octet-stream',
    bytes: checked.bytes,
    sha256Stored: evidence.sha256,
    sha256Now: checked.sha256Now!,
    integrity: checked.integrity,
  };
}
