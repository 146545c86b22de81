import 'server-only';
import { reportCheckpoint } from '@/lib/server/chain/chain-service';
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { getObjectBytes, newObjectKey, putObject } from '@/lib/server/storage/objects';
import { buildReportPdf } from '../../core/reports/report-pdf';
import { findPublishedReport } from './manage-reports';

// A published report never changes, so its PDF is rendered once (on the first request, or right
// after publishing) and kept in object storage with its SHA-256 in parity_report_files. Every later
// request is a storage read, and the hash is the strong ETag.

export type StoredReportPdf = { key: string; sha256: string; sizeBytes: number };
export type ReportPdfHead = { reportId: string; classCode: string; number: number; pdf: StoredReportPdf | null };

type Row = {
  reportId: string;
  classCode: string;
  number: number;
  key: string | null;
  sha256: string | null;
  sizeBytes: number | null;
};

/** What the PDF route needs before any bytes: the report's name parts and its stored PDF, if rendered yet (one query). */
export async function findReportPdfHead(publicId: string): Promise<ReportPdfHead | null> {
  if (!/^[A-Za-z0-9_-]{8,40}$/.test(publicId)) return null;
  const [row] = await getDb().sequelize.query<Row>(
    `select r.id as "reportId", r.inputs->>'classCode' as "classCode", r.number,
            f.object_key as "key", f.sha256, f.size_bytes as "sizeBytes"
       from parity_reports r left join parity_report_files f on f.report_id = r.id and f.kind = 'pdf'
      where r.public_id = :publicId`,
    { replacements: { publicId }, type: QueryTypes.SELECT },
  );
  if (!row) return null;
  const pdf = row.key && row.sha256 ? { key: row.key, sha256: row.sha256, sizeBytes: Number(row.sizeBytes) } : null;
  return { reportId: row.reportId, classCode: row.classCode, number: row.number, pdf };
}

const storedPdf = async (reportId: string) =>
  (
    await getDb().sequelize.query<StoredReportPdf>(
      `select object_key as "key", sha256, size_bytes as "sizeBytes" from parity_report_files where report_id = :reportId and kind = 'pdf'`,
      { replacements: { reportId }, type: QueryTypes.SELECT },
    )
  )[0] ?? null;

// One render per report at a time in this process; across app servers the unique index decides.
const globalForPdf = globalThis as unknown as { __borelineReportPdfs?: Map<string, Promise<StoredReportPdf>> };
const rendering = (globalForPdf.__borelineReportPdfs ??= new Map());

/** The report's stored PDF, rendering and storing it first if nobody has yet. */
export function ensureReportPdf(publicId: string, reportId: string): Promise<StoredReportPdf> {
  let pending = rendering.get(reportId);
  if (!pending) {
    pending = renderAndStore(publicId, reportId).finally(() => rendering.delete(reportId));
    rendering.set(reportId, pending);
  }
  return pending;
}

async function renderAndStore(publicId: string, reportId: string): Promise<StoredReportPdf> {
  const existing = await storedPdf(reportId);
  if (existing) return existing;
  const report = await findPublishedReport(publicId);
  if (!report || report.id !== reportId) throw new Error(`report ${reportId} vanished while its PDF was made`);
  // Times in the PDF are printed in the meeting's own zone, named.
  const timeZone =
    (await getDb().models.Event.findByPk(report.eventId, { attributes: ['timeZone'] }))?.timeZone ?? 'UTC';
  const bytes = await buildReportPdf(report, timeZone, await reportCheckpoint(report.eventId, report.id));
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  const key = newObjectKey('reports/pdf');
  await putObject({ key, bytes, contentType: 'application/pdf', sha256Hex: sha256, metadata: { report: reportId } });
  // Another app server may have stored its own rendering meanwhile: the first row wins and everyone
  // serves that one (our object stays unreferenced, like any upload whose row was never written).
  await getDb().sequelize.query(
    `insert into parity_report_files (report_id, kind, object_key, sha256, size_bytes, content_type)
     values (:reportId, 'pdf', :key, :sha256, :size, 'application/pdf') on conflict (report_id, kind) do nothing`,
    { replacements: { reportId, key, sha256, size: bytes.byteLength } },
  );
  const winner = await storedPdf(reportId);
  if (!winner) throw new Error(`the PDF row for report ${reportId} is missing after insert`);
  return winner;
}

/** The stored bytes, checked against the SHA-256 recorded when they were stored. */
export async function readReportPdf(pdf: StoredReportPdf): Promise<Buffer> {
  const bytes = await getObjectBytes(pdf.key);
  const actual = createHash('sha256').update(bytes).digest('hex');
  if (actual !== pdf.sha256)
    throw new Error(`stored report PDF ${pdf.key} does not match its SHA-256 (${actual} != ${pdf.sha256})`);
  return bytes;
}
