import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { readCatalogue, type CatalogueItemView } from './penalty-catalogue';
import { listTechnicalReports, type TechnicalReportView } from './technical-reports';
import { readPenalties, type PenaltyView } from './penalty-view';

export type PenaltyDesk = {
  entries: { id: string; raceNumber: number; boatName: string; classCode: string }[];
  catalogue: CatalogueItemView[];
  reports: TechnicalReportView[];
  upheldProtests: { id: string; label: string }[];
  penalties: PenaltyView[];
};

/** What the stewards' penalty screen shows: the meeting's entries, catalogue, reports, upheld protests, penalties. */
export async function getPenaltyDesk(actor: Actor | null, eventId: string): Promise<PenaltyDesk> {
  assertCan(actor, 'penalty.apply', { eventId });
  const { sequelize } = getDb();
  const [entries, catalogue, reports, upheldProtests, penalties] = await Promise.all([
    sequelize.query<PenaltyDesk['entries'][number]>(
      `select e.id, e.race_number as "raceNumber", b.name as "boatName", c.code as "classCode"
         from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id
        where e.event_id = :eventId and e.status = 'entered' order by e.race_number`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
    readCatalogue(eventId),
    listTechnicalReports(actor, eventId),
    sequelize.query<{ id: string; label: string }>(
      `select p.id, p.rule_reference || ' against ' ||
              coalesce('#' || e.race_number || ' ' || b.name, 'the results of ' || c.code) as label
         from protests p left join entries e on e.id = p.against_entry_id left join boats b on b.id = e.boat_id
         left join provisional_results r on r.id = p.against_result_id left join race_classes c on c.id = r.class_id
        where p.event_id = :eventId and p.status = 'upheld' order by p.decided_at desc`,
      { replacements: { eventId }, type: QueryTypes.SELECT },
    ),
    readPenalties({ eventId }),
  ]);
  return { entries, catalogue, reports, upheldProtests, penalties };
}
