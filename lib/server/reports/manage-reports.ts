import 'server-only';
import { checkpointQuietly } from '@/lib/server/chain/chain-service';
import { randomBytes } from 'node:crypto';
import { FROM_REPLICA, getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { PublishReportInput } from '@/lib/core/inputs/reports';
import { sendMail } from '@/lib/server/mail/send';
import { gatherReportInputs } from './gather-report-inputs';
import { computeReportResults } from '../../core/reports/parity-figures';
import { toPublishedReportDto, type PublishedReportDto } from '../../core/reports/report-dto';
import { computeClockFromReportInputs } from '@/lib/server/timing/gather-clock-section';
import { appUrl } from '@/lib/server/config/env';

/** The live draft of a class's report: current inspections, not stored. */
export async function computeDraftReport(actor: Actor | null, eventId: string, classId: string) {
  assertCan(actor, 'report.publish', { eventId });
  const inputs = await gatherReportInputs(eventId, classId);
  const clock = await computeClockFromReportInputs(eventId, classId, inputs);
  return { inputs, results: { ...computeReportResults(inputs), clock } };
}

/** Publishes the draft as the next numbered, immutable version and e-mails the class's entrants a link. */
export async function publishReport(
  actor: Actor | null,
  eventId: string,
  classId: string,
  raw: unknown,
): Promise<PublishedReportDto> {
  assertCan(actor, 'report.publish', { eventId });
  const { note } = PublishReportInput.parse(raw ?? {});
  const inputs = await gatherReportInputs(eventId, classId);
  if (inputs.boats.length === 0)
    throw new AppError('conflict', 409, 'No boat has a conforming inspection yet, so there is nothing to publish.');
  // The clock section is computed here and stored with the figures: a later run-time import leaves this version as it is.
  const results = {
    ...computeReportResults(inputs),
    clock: await computeClockFromReportInputs(eventId, classId, inputs),
  };
  const { sequelize, models } = getDb();
  const report = await sequelize.transaction(async (transaction) => {
    // Serialise publications per class so numbers never collide.
    await sequelize.query('select pg_advisory_xact_lock(hashtext(:k))', {
      replacements: { k: `parity:${classId}` },
      transaction,
    });
    const last = (await models.ParityReport.max('number', { where: { classId }, transaction })) as number | null;
    return models.ParityReport.create(
      {
        eventId,
        classId,
        number: (last ?? 0) + 1,
        publicId: randomBytes(12).toString('base64url'),
        ruleVersionId: inputs.ruleVersion.id,
        note,
        inputs,
        results,
        publishedById: actor.id,
      },
      { transaction },
    );
  });
  await checkpointQuietly(eventId, `parity report ${inputs.classCode} version ${report.number} published`);
  const [recipients] = await sequelize.query(
    `select distinct u.email from entries e join users u on u.id = e.entrant_id where e.class_id = :classId and e.status = 'entered'`,
    { replacements: { classId } },
  );
  const base = appUrl();
  await Promise.all(
    (recipients as { email: string }[]).map((r) =>
      sendMail({
        to: r.email,
        subject: `Parity report ${inputs.classCode} v${report.number} published — ${inputs.eventName}`,
        text: `The organiser published version ${report.number} of the ${inputs.className} parity report for ${inputs.eventName}.\n\nRead it: ${base}/reports/${report.publicId}\n\n${note}`,
      }),
    ),
  );
  return toPublishedReportDto(report);
}

/** Published versions of a class's report, newest first (for the organiser). */
export async function listReportVersions(actor: Actor | null, eventId: string, classId: string) {
  assertCan(actor, 'report.publish', { eventId });
  const rows = await getDb().models.ParityReport.findAll({
    where: { eventId, classId },
    order: [['number', 'DESC']],
    attributes: ['id', 'publicId', 'number', 'note', 'publishedAt'],
  });
  return rows.map((r) => ({
    id: r.id,
    publicId: r.publicId,
    number: r.number,
    note: r.note,
    publishedAt: r.publishedAt.toISOString(),
  }));
}

/** A published report by its public id: anyone may read it; drafts have no public id. */
export async function findPublishedReport(
  publicId: string,
): Promise<(PublishedReportDto & { versions: { number: number; publicId: string }[] }) | null> {
  if (!/^[A-Za-z0-9_-]{8,40}$/.test(publicId)) return null;
  const { models } = getDb();
  // A public page reads from a replica when there is one; a report published a moment ago and not
  // there yet is read from the primary (the organiser opens it right after publishing).
  let from = FROM_REPLICA as { useMaster: boolean };
  let report = await models.ParityReport.findOne({ where: { publicId }, ...from });
  if (!report) {
    from = { useMaster: true };
    report = await models.ParityReport.findOne({ where: { publicId }, ...from });
  }
  if (!report) return null;
  const versions = await models.ParityReport.findAll({
    where: { classId: report.classId },
    attributes: ['number', 'publicId'],
    order: [['number', 'ASC']],
    ...from,
  });
  return {
    ...toPublishedReportDto(report),
    versions: versions.map((v) => ({ number: v.number, publicId: v.publicId })),
  };
}

/** The previous published version of the same class, to show what changed. */
export async function findPreviousReport(report: { classId: string; number: number }) {
  const prev = await getDb().models.ParityReport.findOne({
    where: { classId: report.classId, number: report.number - 1 },
  });
  return prev ? toPublishedReportDto(prev) : null;
}
