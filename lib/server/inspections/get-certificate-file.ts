import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { getObjectBytes } from '@/lib/server/storage/objects';

/** A certificate's stored file, for the meeting's officials who see its instruments; another meeting's is "not found". */
export async function getCertificateFile(
  actor: Actor | null,
  eventId: string,
  instrumentId: string,
  certificateId: string,
): Promise<{ bytes: Buffer; contentType: string; fileName: string }> {
  assertCan(actor, 'inspection.board', { eventId });
  const { models } = getDb();
  const instrument = await models.Instrument.findOne({ where: { id: instrumentId, eventId }, attributes: ['id'] });
  const cert = instrument
    ? await models.CalibrationCertificate.findOne({ where: { id: certificateId, instrumentId } })
    : null;
  if (!cert || !cert.objectKey || !cert.contentType) throw new AppError('not_found', 404, 'No such certificate file.');
  const ext = cert.contentType === 'application/pdf' ? 'pdf' : (cert.contentType.split('/')[1] ?? 'bin');
  // Built from the certificate number, never from an uploaded name: letters, digits and dashes only.
  const fileName = `certificate-${cert.number.replace(/[^A-Za-z0-9-]+/g, '-').slice(0, 60)}.${ext}`;
  return { bytes: await getObjectBytes(cert.objectKey), contentType: cert.contentType, fileName };
}
