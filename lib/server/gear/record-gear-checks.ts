import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError, type FieldIssue } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { RecordGearChecksInput } from '@/lib/core/inputs/crew';
import { buildEntryCrewView, entryForDockToday, type EntryCrewView } from '@/lib/server/crew/crew-data';

/**
 * A scrutineer of the meeting records what they saw of an entry's gear today (the meeting's calendar
 * day in its zone). Each check keeps the item as declared at that moment, append-only; the latest check
 * of the day counts while the item still reads the same. Kept apart from the inspection record on
 * purpose: the verdict's record path is unchanged, and the gear findings are shown beside it.
 */
export async function recordGearChecks(
  actor: Actor | null,
  eventId: string,
  readInput: () => Promise<unknown>,
  now = new Date(),
): Promise<EntryCrewView> {
  const evId = parseId(eventId, 'meeting');
  assertCan(actor, 'inspection.record', { eventId: evId });
  const input = RecordGearChecksInput.parse(await readInput());
  const { entry, day } = await entryForDockToday(actor, evId, input.entryId, now, {
    ownBoat: 'You entered or own this boat: another scrutineer must check its gear.',
    notMeetingDay: 'Gear is confirmed on a meeting day',
  });
  const { sequelize, models } = getDb();
  const items = await sequelize.query<{ id: string; kind: string; standard: string; serial: string; dueOn: string }>(
    `select id, kind, standard, serial, to_char(due_on, 'YYYY-MM-DD') as "dueOn" from entry_gear_items where entry_id = :entryId`,
    { replacements: { entryId: entry.id }, type: QueryTypes.SELECT },
  );
  const byId = new Map(items.map((i) => [i.id, i]));
  const unknown: FieldIssue[] = input.items
    .map((c, i) =>
      byId.has(c.gearItemId.toLowerCase())
        ? null
        : { field: `items.${i}.gearItemId`, message: 'Not an item of this boat.' },
    )
    .filter((x): x is FieldIssue => x !== null);
  if (unknown.length) throw new AppError('invalid_input', 400, 'Some items are not of this boat.', unknown);
  await models.GearCheck.bulkCreate(
    input.items.map((c) => {
      const item = byId.get(c.gearItemId.toLowerCase())!;
      return {
        eventId: evId,
        entryId: entry.id,
        gearItemId: item.id,
        meetingDay: day,
        outcome: c.outcome,
        kind: item.kind,
        standard: item.standard,
        serial: item.serial,
        dueOn: item.dueOn,
        note: c.note,
        checkedById: actor.id,
        checkedAt: now,
      };
    }),
  );
  return buildEntryCrewView(entry, now, actor.id);
}
