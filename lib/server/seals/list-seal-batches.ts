import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';

export type SealBatchView = {
  id: string;
  prefix: string;
  firstNumber: number;
  lastNumber: number;
  firstSeal: string;
  lastSeal: string;
  count: number;
  /** Seals of the batch with at least one event. */
  used: number;
  note: string;
  issuedBy: string;
  createdAt: string;
};

/** The batches issued to a meeting, newest first, with how many of each are used. */
export async function listSealBatches(actor: Actor | null, eventId: string): Promise<SealBatchView[]> {
  assertCan(actor, 'inspection.board', { eventId });
  const rows = await getDb().sequelize.query<Omit<SealBatchView, 'createdAt'> & { createdAt: Date }>(
    `select b.id, b.prefix, b.first_number as "firstNumber", b.last_number as "lastNumber", b.note,
            coalesce(u.name, u.email) as "issuedBy", b.created_at as "createdAt",
            (select min(s.number) from seals s where s.batch_id = b.id) as "firstSeal",
            (select max(s.number) from seals s where s.batch_id = b.id) as "lastSeal",
            (select count(*)::int from seals s where s.batch_id = b.id) as count,
            (select count(*)::int from seals s where s.batch_id = b.id and exists (select 1 from seal_events e where e.seal_id = s.id)) as used
       from seal_batches b join users u on u.id = b.issued_by_id
      where b.event_id = :eventId
      order by b.created_at desc`,
    { replacements: { eventId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ ...r, createdAt: new Date(r.createdAt).toISOString() }));
}
