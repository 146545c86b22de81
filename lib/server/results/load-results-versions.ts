import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { ResultAmendment, ResultRow, ResultsSource } from '@/models/provisional-results';

export type ResultsVersion = {
  id: string;
  classId: string;
  version: number;
  publishedAt: Date;
  publishedById: string;
  rows: ResultRow[];
  changedEntryIds: string[];
  source: ResultsSource;
  note: string;
  amendments: ResultAmendment[];
};

/** Every published results version of a meeting (optionally of one class), oldest first. */
export async function loadResultsVersions(
  eventId: string,
  opts: { classId?: string; transaction?: Transaction } = {},
): Promise<ResultsVersion[]> {
  const rows = await getDb().models.ProvisionalResults.findAll({
    where: { eventId, ...(opts.classId && { classId: opts.classId }) },
    order: [
      ['classId', 'ASC'],
      ['version', 'ASC'],
    ],
    transaction: opts.transaction,
  });
  return rows.map((r) => ({
    id: r.id,
    classId: r.classId,
    version: r.version,
    publishedAt: r.publishedAt,
    publishedById: r.publishedById,
    rows: r.rows,
    changedEntryIds: r.changedEntryIds ?? [],
    source: r.source,
    note: r.note,
    amendments: r.amendments ?? [],
  }));
}
