import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import type { ComponentKind } from '@/models/boat-record';

export type SerialMatch = {
  componentId: string;
  kind: ComponentKind;
  maker: string;
  model: string;
  serialNumber: string;
  trimCode: string;
  boatId: string;
  boatName: string;
  entryId: string;
  raceNumber: number;
  entryStatus: string;
  /**
   * The same part (kind, maker, serial) is declared on another boat here too: two owners claim it, and
   * an official, not whoever typed it first, decides who holds it.
   */
  isDisputed: boolean;
};

const refuse = (message: string, status = 400, code = 'invalid_input') =>
  new AppError(code, status, `serial: ${message}`, [{ field: 'serial', message }]);

/**
 * The dock's lookup by a component's serial number (as stamped on an engine, pump or impeller): the
 * boats entered at this meeting that carry a component with that serial now, each saying which
 * component matched. Only for those who record inspections here; a boat not entered at this
 * meeting is never found, so the lookup tells nothing about other meetings' boats. One part declared
 * by two owners (the identity is unique per owner only) comes back as two matches marked disputed.
 */
export async function findBoatsBySerial(
  actor: Actor | null,
  eventId: string,
  serialText: string,
): Promise<{ matches: SerialMatch[] }> {
  assertCan(actor, 'inspection.record', { eventId });
  // As the register holds serials: in NFKC (a full-width "１" typed on a phone is "1").
  const serial = serialText.normalize('NFKC').trim();
  if (serial.length === 0 || serial.length > 80)
    throw refuse('Type the serial number as stamped (1 to 80 characters).');
  // A boat's live entry here if it has one, else its latest (a withdrawn boat still shows, marked so).
  const matches = await getDb().sequelize.query<Omit<SerialMatch, 'isDisputed'>>(
    `select distinct on (c.id) c.id as "componentId", c.kind, c.maker, c.model, c.serial_number as "serialNumber",
            c.trim_code as "trimCode", b.id as "boatId", b.name as "boatName", e.id as "entryId",
            e.race_number as "raceNumber", e.status as "entryStatus"
       from boat_components c
       join boats b on b.id = c.boat_id
       join entries e on e.boat_id = b.id and e.event_id = :eventId
      where lower(c.serial_number) = lower(:serial)
      order by c.id, (e.status in ('awaiting_payment', 'entered')) desc, e.created_at desc`,
    { replacements: { eventId, serial }, type: QueryTypes.SELECT },
  );
  if (matches.length === 0)
    throw refuse(`No boat entered at this meeting carries a component with serial ${serial}.`, 404, 'unknown_serial');
  const identity = (m: Omit<SerialMatch, 'isDisputed'>) =>
    `${m.kind}\u0000${m.maker.toLowerCase()}\u0000${m.serialNumber.toLowerCase()}`;
  const boatsPerIdentity = new Map<string, Set<string>>();
  for (const m of matches)
    boatsPerIdentity.set(identity(m), (boatsPerIdentity.get(identity(m)) ?? new Set()).add(m.boatId));
  return {
    matches: matches
      .map((m) => ({ ...m, isDisputed: boatsPerIdentity.get(identity(m))!.size > 1 }))
      .sort((a, b) => a.raceNumber - b.raceNumber),
  };
}
