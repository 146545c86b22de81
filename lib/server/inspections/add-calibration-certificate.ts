import 'server-only';
import { getDb } from '@/lib/server/db';
import { type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { AddCertificateInput, CERTIFICATE_MAX_BYTES } from '@/lib/core/inputs/instrument-calibration';
import { readFormBody } from '@/lib/server/http/read-body';
import { DOCUMENT_TYPES, inspectUpload } from '@/lib/server/storage/inspect-upload';
import { newObjectKey, putObject } from '@/lib/server/storage/objects';
import { assertCanManageInstruments } from './manage-instruments-access';

export type CertificateView = {
  id: string;
  instrumentId: string;
  number: string;
  laboratory: string;
  calibratedOn: string;
  dueOn: string;
  expandedUncertainty: number | null;
  coverageFactor: number;
  contentType: string | null;
  sizeBytes: number | null;
  sha256: string | null;
  createdAt: string;
};

const MB = CERTIFICATE_MAX_BYTES / (1024 * 1024);

/**
 * Adds a calibration certificate to one of the meeting's instruments: permission first (before a
 * byte of the body is read), then the fields, then the file (size, type from its bytes, SHA-256),
 * stored before the row so no row points at nothing. Certificates are append-only.
 */
export async function addCalibrationCertificate(
  actor: Actor | null,
  eventId: string,
  instrumentId: string,
  req: Request,
): Promise<CertificateView> {
  assertCanManageInstruments(actor, eventId);
  const { models } = getDb();
  const instrument = await models.Instrument.findOne({ where: { id: instrumentId, eventId }, attributes: ['id'] });
  if (!instrument) throw new AppError('not_found', 404, 'No such instrument at this meeting.');
  const form = await readFormBody(req, CERTIFICATE_MAX_BYTES + 64 * 1024, {
    field: 'file',
    wrongType: 'Send the certificate as multipart/form-data with its file in the field "file".',
    tooLarge: `The upload is too large: a certificate may be up to ${MB} MB.`,
    tooLargeField: `A certificate file may be up to ${MB} MB.`,
    unreadable: 'file: the upload could not be read as a form.',
  });
  const field = (name: string) => {
    const v = form.get(name);
    return typeof v === 'string' ? v : undefined;
  };
  const input = AddCertificateInput.parse({
    number: field('number'),
    laboratory: field('laboratory'),
    calibratedOn: field('calibratedOn'),
    dueOn: field('dueOn'),
    expandedUncertainty: field('expandedUncertainty') ?? null,
    coverageFactor: field('coverageFactor') ?? null,
  });
  const file = form.get('file');
  if (!(file instanceof File) || file.size === 0)
    throw new AppError('invalid_input', 400, 'file: attach the certificate (PDF or a photo of it).', [
      { field: 'file', message: 'Attach the certificate (PDF or a photo of it).' },
    ]);
  const bytes = new Uint8Array(await file.arrayBuffer());
  let checked;
  try {
    checked = inspectUpload({
      bytes,
      declaredName: file.name,
      allowed: DOCUMENT_TYPES,
      maxBytes: CERTIFICATE_MAX_BYTES,
    });
  } catch (err) {
    if (err instanceof AppError)
      throw new AppError(err.code, err.status, err.message, [{ field: 'file', message: err.message }]);
    throw err;
  }
  const objectKey = newObjectKey('calibration-certificates');
  await putObject({
    key: objectKey,
    bytes,
    contentType: checked.detectedType,
    metadata: { instrumentId, uploadedById: actor.id },
    sha256Hex: checked.sha256Hex,
  });
  const row = await models.CalibrationCertificate.create({
    instrumentId,
    number: input.number,
    laboratory: input.laboratory,
    calibratedOn: input.calibratedOn,
    dueOn: input.dueOn,
    expandedUncertainty: input.expandedUncertainty,
    coverageFactor: input.coverageFactor ?? 2,
    objectKey,
    contentType: checked.detectedType,
    sizeBytes: checked.sizeBytes,
    sha256: checked.sha256Hex,
    addedById: actor.id,
  });
  return {
    id: row.id,
    instrumentId,
    number: row.number,
    laboratory: row.laboratory,
    calibratedOn: String(row.calibratedOn),
    dueOn: String(row.dueOn),
    expandedUncertainty: row.expandedUncertainty ?? null,
    coverageFactor: Number(row.coverageFactor),
    contentType: row.contentType ?? null,
    sizeBytes: row.sizeBytes ?? null,
    sha256: row.sha256 ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}
