import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { PenaltyKind } from '../../core/penalties/penalty-kinds';

export type PenaltyView = {
  id: string;
  eventId: string;
  entryId: string;
  classId: string;
  raceNumber: number;
  boatName: string;
  code: string;
  kind: PenaltyKind;
  amount: number | null;
  label: string;
  runLabel: string | null;
  reason: string;
  protestId: string | null;
  technicalReportId: string | null;
  appealId: string | null; // set when the appeal body's amendment imposed it
  replacesPenaltyId: string | null;
  decidedAt: string;
  decidedByName: string;
  appealDeadline: string; // notice of appeal is due by then (the meeting's appeal notice after the decision)
  /** in_force, or what an appeal made of it (annulled, replaced by the amending penalty). */
  state: 'in_force' | 'annulled' | 'replaced';
  appealPending: boolean;
};

/** Penalties of a meeting (or one), with what appeals made of them. */
export async function readPenalties(
  where: { eventId: string } | { penaltyId: string },
  transaction?: Transaction,
): Promise<PenaltyView[]> {
  const rows = await getDb().sequelize.query<
    Omit<PenaltyView, 'decidedAt' | 'appealDeadline'> & { decidedAt: Date; appealDeadline: Date }
  >(
    `select p.id, p.event_id as "eventId", p.entry_id as "entryId", e.class_id as "classId", e.race_number as "raceNumber",
            b.name as "boatName", p.code, p.kind, p.amount, p.label, p.run_label as "runLabel", p.reason,
            p.protest_id as "protestId", p.technical_report_id as "technicalReportId", p.appeal_id as "appealId",
            p.replaces_penalty_id as "replacesPenaltyId", p.decided_at as "decidedAt",
            coalesce(u.name, u.email) as "decidedByName",
            p.decided_at + make_interval(mins => ev.appeal_notice_minutes) as "appealDeadline",
            case when exists (select 1 from appeals a where a.penalty_id = p.id and a.status = 'annulled') then 'annulled'
                 when exists (select 1 from appeals a where a.penalty_id = p.id and a.status = 'amended') then 'replaced'
                 else 'in_force' end as state,
            exists (select 1 from appeals a where a.penalty_id = p.id and a.status in ('lodged', 'hearing_scheduled')) as "appealPending"
       from penalties p join entries e on e.id = p.entry_id join boats b on b.id = e.boat_id
       join events ev on ev.id = p.event_id join users u on u.id = p.decided_by_id
      where ${'eventId' in where ? 'p.event_id = :id' : 'p.id = :id'}
      order by p.decided_at, p.id`,
    {
      replacements: { id: 'eventId' in where ? where.eventId : where.penaltyId },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return rows.map((r) => ({
    ...r,
    decidedAt: new Date(r.decidedAt).toISOString(),
    appealDeadline: new Date(r.appealDeadline).toISOString(),
  }));
}
