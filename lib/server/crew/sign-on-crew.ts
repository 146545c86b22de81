import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError, type FieldIssue } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { SignOnCrewInput } from '@/lib/core/inputs/crew';
import { PERSON_FINDINGS } from '@/lib/core/crew/assess-crew';
import { buildEntryCrewView, entryForDockToday, type EntryCrewView } from './crew-data';

/**
 * An official of the meeting signs people of an entry on for today (the meeting's calendar day in its
 * zone): once a day each, append-only. A person whose licence, medical or guardian's consent is not in
 * order today is refused, naming why (the officials sort it out first; the local rulebook decides).
 */
export async function signOnCrew(
  actor: Actor | null,
  eventId: string,
  readInput: () => Promise<unknown>,
  now = new Date(),
): Promise<EntryCrewView> {
  const evId = parseId(eventId, 'meeting');
  assertCan(actor, 'inspection.record', { eventId: evId });
  const input = SignOnCrewInput.parse(await readInput());
  const { entry, day } = await entryForDockToday(actor, evId, input.entryId, now, {
    ownBoat: 'You entered or own this boat: another official must sign its crew on.',
    notMeetingDay: 'Crews sign on on a meeting day',
  });
  const view = await buildEntryCrewView(entry, now, actor.id);
  const ids = input.crewMemberIds.map((i) => i.toLowerCase());
  const unknown: FieldIssue[] = ids
    .map((id, i) =>
      view.members.some((m) => m.id === id)
        ? null
        : { field: `crewMemberIds.${i}`, message: 'Not a person of this boat.' },
    )
    .filter((x): x is FieldIssue => x !== null);
  if (unknown.length) throw new AppError('invalid_input', 400, 'Some people are not of this boat.', unknown);
  const blocked = view.assessment.findings.filter(
    (f) => f.severity === 'finding' && f.memberId && ids.includes(f.memberId) && PERSON_FINDINGS.includes(f.code),
  );
  if (blocked.length)
    throw new AppError(
      'not_in_order',
      409,
      `Not signed on: ${blocked.map((f) => f.text).join(' ')}`,
      blocked.map((f) => ({ field: `crewMemberIds.${ids.indexOf(f.memberId!)}`, message: f.text })),
    );
  await getDb().sequelize.query(
    `insert into crew_sign_ons (event_id, entry_id, crew_member_id, meeting_day, role, name, licence_number, signed_on_by_id, signed_on_at)
     select :eventId, :entryId, m.id, :day, m.role, m.name, m.licence_number, :actorId, :now
       from entry_crew_members m where m.entry_id = :entryId and m.id in (:ids)
     on conflict (crew_member_id, meeting_day, name, coalesce(licence_number, '')) do nothing`,
    { replacements: { eventId: evId, entryId: entry.id, day, actorId: actor.id, now, ids }, type: QueryTypes.INSERT },
  );
  return buildEntryCrewView(entry, now);
}
