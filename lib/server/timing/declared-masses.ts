import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { DeclareMassesInput } from '@/lib/core/inputs/declared-masses';

/** An entry's current crew and fuel declaration (null: not declared, the assumption is used). */
export type DeclaredMasses = {
  entryId: string;
  crewKg: number | null;
  fuelKg: number | null;
  declaredAt: string;
};

type Row = { entryId: string; crewKg: number | null; fuelKg: number | null; declaredAt: Date };
const toView = (r: Row): DeclaredMasses => ({ ...r, declaredAt: new Date(r.declaredAt).toISOString() });

/** The current (newest) declaration of each entry the where clause picks, as a lateral join on entries e. */
const CURRENT_SQL = `select d.entry_id as "entryId", d.crew_kg as "crewKg", d.fuel_kg as "fuelKg", d.declared_at as "declaredAt"
       from entries e
       join lateral (select * from entry_mass_declarations x where x.entry_id = e.id
                      order by x.declared_at desc, x.id desc limit 1) d on true`;

/**
 * Declares the crew and fuel masses of one entry: its entrant, or an organiser of its meeting (who may correct
 * them). Whoever else asks learns nothing (404, as for a missing entry), and the body is read only after that
 * check. A withdrawn or cancelled entry takes no declaration (409). Append-only: a new row for each change.
 */
export async function declareEntryMasses(
  actor: Actor | null,
  entryId: string,
  readInput: () => Promise<unknown>,
): Promise<DeclaredMasses> {
  assertCan(actor, 'entry.submit_own');
  const id = parseId(entryId, 'entry');
  const { sequelize } = getDb();
  const [entry] = await sequelize.query<{ eventId: string; entrantId: string }>(
    `select e.event_id as "eventId", e.entrant_id as "entrantId" from entries e where e.id = :id`,
    { replacements: { id }, type: QueryTypes.SELECT },
  );
  if (!entry || !(entry.entrantId === actor.id || can(actor, 'results.publish', { eventId: entry.eventId })))
    throw new AppError('not_found', 404, 'No such entry among yours.');
  const input = DeclareMassesInput.parse(await readInput());
  // One statement: a withdrawn or cancelled entry stores nothing; the same figures as the current declaration store
  // nothing either (a repeated PUT is idempotent, and a client repeating it does not grow the history); the answer is
  // the current declaration, new or kept (the left join takes the current row only when nothing was added).
  const [row] = await sequelize.query<Row & { isOpen: boolean }>(
    `with entry as (select e.id, e.status in ('awaiting_payment', 'entered') as open from entries e where e.id = :id for update),
          current as (select d.* from entry_mass_declarations d where d.entry_id = :id order by d.declared_at desc, d.id desc limit 1),
          added as (
            insert into entry_mass_declarations (entry_id, crew_kg, fuel_kg, declared_by_id)
            select entry.id, :crewKg, :fuelKg, :actorId from entry
             where entry.open and not exists (
               select 1 from current c where c.crew_kg is not distinct from cast(:crewKg as double precision)
                                         and c.fuel_kg is not distinct from cast(:fuelKg as double precision))
            returning entry_id, crew_kg, fuel_kg, declared_at)
     select entry.open as "isOpen", coalesce(a.entry_id, c.entry_id) as "entryId", coalesce(a.crew_kg, c.crew_kg) as "crewKg",
            coalesce(a.fuel_kg, c.fuel_kg) as "fuelKg", coalesce(a.declared_at, c.declared_at) as "declaredAt"
       from entry left join added a on true left join current c on a.entry_id is null`,
    { replacements: { id, crewKg: input.crewKg, fuelKg: input.fuelKg, actorId: actor.id }, type: QueryTypes.SELECT },
  );
  if (!row?.isOpen)
    throw new AppError('conflict', 409, 'This entry is withdrawn or cancelled: its crew and fuel cannot be declared.');
  return toView(row);
}

/** The actor's own entries' current declarations, by entry id (entries never declared are absent). */
export async function listMyDeclaredMasses(actor: Actor | null): Promise<Record<string, DeclaredMasses>> {
  assertCan(actor, 'entry.submit_own');
  const rows = await getDb().sequelize.query<Row>(`${CURRENT_SQL} where e.entrant_id = :uid`, {
    replacements: { uid: actor.id },
    type: QueryTypes.SELECT,
  });
  return Object.fromEntries(rows.map((r) => [r.entryId, toView(r)]));
}

/**
 * The current declarations of a class's entries at a meeting, by entry id, for the predicted runs (no permission
 * check: the caller, the clock section or the parity report, has made it).
 */
export async function readClassDeclaredMasses(
  eventId: string,
  classId: string,
): Promise<Map<string, { crewKg: number | null; fuelKg: number | null }>> {
  const rows = await getDb().sequelize.query<Row>(
    `${CURRENT_SQL} where e.event_id = :eventId and e.class_id = :classId`,
    { replacements: { eventId, classId }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.entryId, { crewKg: r.crewKg, fuelKg: r.fuelKg }]));
}
