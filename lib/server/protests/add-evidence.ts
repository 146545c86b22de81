import 'server-only';
import type { InferCreationAttributes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import type { ProtestEvidence } from '@/models';
import { AppError } from '@/lib/core/errors';
import { inspectUpload, EVIDENCE_TYPES } from '@/lib/server/storage/inspect-upload';
import { newObjectKey, putObject } from '@/lib/server/storage/objects';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { findProtestForActor } from './find-protest-for-actor';
import { EvidenceNoteInput } from '../../core/inputs/protests';
import { EVIDENCE_MAX_BYTES, OPEN_STATUSES } from '../../core/protests/protest-states';
import { listEvidence, type EvidenceView } from './list-evidence';

export type EvidenceUpload = { kind: 'file'; bytes: Uint8Array; declaredName: string };

/**
 * Adds one piece of evidence: a file (photo, PDF, phone video), a note (a witness statement) or,
 * for stewards, a link to an inspection record of the meeting. Parties and the meeting's stewards
 * may add evidence until the matter is decided. A file's type comes from its bytes (415), its size
 * is capped (413) and its SHA-256 is stored; nothing is ever replaced or deleted (the database
 * refuses it). The bytes are stored first, so a row never points at a missing object.
 */
export async function addEvidence(
  actor: Actor | null,
  protestId: string,
  input: EvidenceUpload | unknown,
): Promise<EvidenceView> {
  const access = await findProtestForActor(actor, protestId);
  const { protest } = access;
  if (!access.isLodger && !access.isProtested && !access.canDecide)
    throw new AppError('forbidden', 403, 'Only the parties and the stewards add evidence.');
  if (!OPEN_STATUSES.includes(protest.status))
    throw new AppError('closed', 409, 'This protest has been decided: no more evidence can be added.');
  const { models, sequelize } = getDb();
  const base = { protestId: protest.id, addedById: actor!.id };
  let row: Pick<InferCreationAttributes<ProtestEvidence>, 'protestId' | 'addedById' | 'kind'> &
    Partial<InferCreationAttributes<ProtestEvidence>>;

  if (
    typeof input === 'object' &&
    input !== null &&
    (input as EvidenceUpload).kind === 'file' &&
    (input as EvidenceUpload).bytes instanceof Uint8Array
  ) {
    const upload = input as EvidenceUpload;
    let file;
    try {
      file = inspectUpload({
        bytes: upload.bytes,
        declaredName: upload.declaredName,
        allowed: EVIDENCE_TYPES,
        maxBytes: EVIDENCE_MAX_BYTES,
      });
    } catch (err) {
      if (err instanceof AppError)
        throw new AppError(err.code, err.status, err.message, [{ field: 'file', message: err.message }]);
      throw err;
    }
    const objectKey = newObjectKey('evidence');
    await putObject({
      key: objectKey,
      bytes: upload.bytes,
      contentType: file.detectedType,
      metadata: { protestId: protest.id, addedById: actor!.id },
      sha256Hex: file.sha256Hex,
    });
    row = {
      ...base,
      kind: 'file',
      objectKey,
      fileName: file.safeName,
      contentType: file.detectedType,
      sizeBytes: file.sizeBytes,
      sha256: file.sha256Hex,
    };
  } else {
    const parsed = EvidenceNoteInput.parse(input);
    if (parsed.kind === 'note') row = { ...base, kind: 'note', note: parsed.note };
    else {
      if (!access.canDecide) throw new AppError('forbidden', 403, 'Linking an inspection record is for the stewards.');
      const inspection = await models.Inspection.findOne({
        where: { id: parsed.inspectionId.toLowerCase(), eventId: protest.eventId },
        attributes: ['id'],
      });
      if (!inspection)
        throw new AppError('invalid_input', 400, 'inspectionId: no such inspection at this meeting.', [
          { field: 'inspectionId', message: 'No such inspection at this meeting.' },
        ]);
      row = { ...base, kind: 'inspection_link', inspectionId: inspection.id };
    }
  }
  const id = await sequelize.transaction(async (transaction) => {
    const created = await models.ProtestEvidence.create(row, { transaction });
    await recordAuditEvent(
      {
        eventId: protest.eventId,
        actorId: actor!.id,
        subjectType: 'protest',
        subjectId: protest.id,
        action: 'protest.evidence_added',
        details: {
          evidenceId: created.id,
          kind: created.kind,
          sha256: created.sha256 ?? undefined,
          fileName: created.fileName ?? undefined,
          inspectionId: created.inspectionId ?? undefined,
        },
      },
      transaction,
    );
    return created.id;
  });
  const all = await listEvidence(actor, protest.id);
  return all.find((e) => e.id === id)!;
}
