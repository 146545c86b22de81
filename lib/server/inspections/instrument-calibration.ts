import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { CalibrationCertificate, InstrumentCheck } from '@/models';
import type { CertificateFacts, CheckFacts } from '../../core/inspections/calibration-state';

export type CalibrationFacts = { certificates: CertificateFacts[]; checks: CheckFacts[] };

export function toCertificateFacts(c: CalibrationCertificate): CertificateFacts {
  return {
    id: c.id,
    number: c.number,
    laboratory: c.laboratory,
    calibratedOn: String(c.calibratedOn),
    dueOn: String(c.dueOn),
    expandedUncertainty: c.expandedUncertainty ?? null,
    coverageFactor: Number(c.coverageFactor),
    hasFile: c.objectKey != null,
  };
}

export function toCheckFacts(c: InstrumentCheck): CheckFacts {
  return { meetingDay: String(c.meetingDay), passed: c.passed, checkedAt: c.checkedAt };
}

/** Every certificate and check of these instruments (two queries), by instrument id. */
export async function loadCalibrationFacts(instrumentIds: readonly string[]): Promise<Map<string, CalibrationFacts>> {
  const out = new Map<string, CalibrationFacts>(instrumentIds.map((id) => [id, { certificates: [], checks: [] }]));
  if (instrumentIds.length === 0) return out;
  const { models } = getDb();
  const where = { instrumentId: { [Op.in]: [...instrumentIds] } };
  const [certificates, checks] = await Promise.all([
    models.CalibrationCertificate.findAll({ where, order: [['createdAt', 'ASC']] }),
    models.InstrumentCheck.findAll({ where, order: [['checkedAt', 'ASC']] }),
  ]);
  for (const c of certificates) out.get(c.instrumentId)?.certificates.push(toCertificateFacts(c));
  for (const c of checks) out.get(c.instrumentId)?.checks.push(toCheckFacts(c));
  return out;
}

/** The meeting's time zone (dates of certificates and checks are read in it). */
export async function eventTimeZone(eventId: string): Promise<string | null> {
  const e = await getDb().models.Event.findByPk(eventId, { attributes: ['id', 'timeZone'] });
  return e?.timeZone ?? null;
}
