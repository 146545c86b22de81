import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { fieldError } from '@/lib/core/errors';
import {
  AppointSeriesOfficialInput,
  AssignRaceNumberInput,
  CreateSeriesClassInput,
  LinkRoundInput,
  PublishSeriesRulesInput,
} from '@/lib/core/inputs/series';
import { inviteSeriesOfficial } from '@/lib/server/auth/invitations';
import { assertSeriesExists, findSeriesClass } from './series-access';

const uniqueViolation = (e: unknown) => (e as { parent?: { code?: string } })?.parent?.code === '23505';

/**
 * The secretary appoints a series secretary or steward by e-mail address, always by an invitation mailed to that
 * address: nothing here asks whether the address has an account, so the answer (status, body, mail) is the same
 * either way and tells the secretary nothing about who has one (OWASP ASVS 5.0, V6 Authentication). The person
 * holds the role once they accept from that mailbox. Someone already among the series' officials in that role is
 * refused (409): the secretary sees that list anyway.
 */
export async function appointSeriesOfficial(actor: Actor | null, seriesId: string, readInput: () => Promise<unknown>) {
  assertCan(actor, 'series.manage', { seriesId });
  const input = AppointSeriesOfficialInput.parse(await readInput());
  const [held] = await getDb().sequelize.query(
    `select 1 from series_officials o join users u on u.id = o.user_id
      where o.series_id = :seriesId and o.role = :role and lower(u.email) = :email`,
    { replacements: { seriesId, role: input.role, email: input.email }, type: QueryTypes.SELECT },
  );
  if (held) throw fieldError('email', 'This person already holds this role in the series.', 409);
  return inviteSeriesOfficial(actor, seriesId, input);
}

/** A class of the series with its points table (points per place) and dropped rounds. */
export async function createSeriesClass(actor: Actor | null, seriesId: string, readInput: () => Promise<unknown>) {
  assertCan(actor, 'series.manage', { seriesId });
  const input = CreateSeriesClassInput.parse(await readInput());
  await assertSeriesExists(seriesId);
  try {
    const [row] = await getDb().sequelize.query<{ id: string }>(
      `insert into series_classes (series_id, code, name, points_by_position, dropped_rounds)
       values (:seriesId, :code, :name, :points::jsonb, :droppedRounds) returning id`,
      {
        replacements: { seriesId, ...input, points: JSON.stringify(input.pointsByPosition) },
        type: QueryTypes.SELECT,
      },
    );
    return { id: row.id, ...input };
  } catch (e) {
    if (uniqueViolation(e)) throw fieldError('code', 'This series already has a class with this code.', 409);
    throw e;
  }
}

/**
 * Publishes the series class's next rules version (append-only): the class rules' own shape, an effective
 * date not before the previous version's, and a change note from version 2 on.
 */
export async function publishSeriesRules(
  actor: Actor | null,
  seriesId: string,
  seriesClassId: string,
  readInput: () => Promise<unknown>,
) {
  assertCan(actor, 'series.manage', { seriesId });
  const input = PublishSeriesRulesInput.parse(await readInput());
  const { sequelize } = getDb();
  return sequelize.transaction(async (transaction) => {
    await findSeriesClass(seriesId, seriesClassId, transaction);
    await sequelize.query(`select 1 from series_classes where id = :seriesClassId for update`, {
      replacements: { seriesClassId },
      transaction,
    });
    const [last] = await sequelize.query<{ version: number; effectiveFrom: string }>(
      `select version, effective_from::text as "effectiveFrom" from series_rule_versions
        where series_class_id = :seriesClassId order by version desc limit 1`,
      { replacements: { seriesClassId }, type: QueryTypes.SELECT, transaction },
    );
    if (last && input.effectiveFrom < last.effectiveFrom)
      throw fieldError('effectiveFrom', `Choose ${last.effectiveFrom} or later (version ${last.version}).`);
    if (last && !input.changeNote) throw fieldError('changeNote', 'Say what changed from the previous version.');
    const version = (last?.version ?? 0) + 1;
    const [row] = await sequelize.query<{ id: string }>(
      `insert into series_rule_versions (series_class_id, version, rules, change_note, effective_from, published_by_id)
       values (:seriesClassId, :version, :rules::jsonb, :changeNote, :effectiveFrom, :actorId) returning id`,
      {
        replacements: {
          seriesClassId,
          version,
          rules: JSON.stringify(input.rules),
          changeNote: input.changeNote,
          effectiveFrom: input.effectiveFrom,
          actorId: actor.id,
        },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    return { id: row.id, version, effectiveFrom: input.effectiveFrom, changeNote: input.changeNote };
  });
}

/**
 * Makes a meeting's class a round of the series class. Only a meeting of one of the series' organisations
 * may be a round, and a class follows one series class at most (linking it again is refused).
 */
export async function linkRound(
  actor: Actor | null,
  seriesId: string,
  seriesClassId: string,
  readInput: () => Promise<unknown>,
) {
  assertCan(actor, 'series.manage', { seriesId });
  const input = LinkRoundInput.parse(await readInput());
  const { sequelize } = getDb();
  return sequelize.transaction(async (transaction) => {
    await findSeriesClass(seriesId, seriesClassId, transaction);
    const [cls] = await sequelize.query<{ seriesClassId: string | null; inSeries: boolean; eventId: string }>(
      `select rc.series_class_id as "seriesClassId", rc.event_id as "eventId",
              exists (select 1 from series_organisations so where so.series_id = :seriesId and so.organisation_id = ev.organisation_id) as "inSeries"
         from race_classes rc join events ev on ev.id = rc.event_id where rc.id = :classId for update of rc`,
      { replacements: { seriesId, classId: input.classId }, type: QueryTypes.SELECT, transaction },
    );
    if (!cls || !cls.inSeries)
      throw fieldError('classId', "Choose a class of a meeting run by one of the series' organisations.");
    if (cls.seriesClassId === seriesClassId) return { classId: input.classId, eventId: cls.eventId };
    if (cls.seriesClassId) throw fieldError('classId', 'This class is already a round of another series class.', 409);
    await sequelize.query(`update race_classes set series_class_id = :seriesClassId where id = :classId`, {
      replacements: { seriesClassId, classId: input.classId },
      transaction,
    });
    return { classId: input.classId, eventId: cls.eventId };
  });
}

/**
 * A season race number for a boat, unique in the series class; one number per boat. Only a boat entered at a
 * meeting of one of the series' organisations: its owner then receives the class's bulletins, so a number
 * must not put a stranger's boat (any boat id seen on a public page) on the series' mailing list.
 */
export async function assignRaceNumber(
  actor: Actor | null,
  seriesId: string,
  seriesClassId: string,
  readInput: () => Promise<unknown>,
) {
  assertCan(actor, 'series.manage', { seriesId });
  const input = AssignRaceNumberInput.parse(await readInput());
  await findSeriesClass(seriesId, seriesClassId);
  const { sequelize } = getDb();
  const [boat] = await sequelize.query(
    `select 1 from entries e join events ev on ev.id = e.event_id
       join series_organisations so on so.organisation_id = ev.organisation_id and so.series_id = :seriesId
      where e.boat_id = :boatId and e.status in ('awaiting_payment', 'entered') limit 1`,
    { replacements: { seriesId, boatId: input.boatId }, type: QueryTypes.SELECT },
  );
  if (!boat) throw fieldError('boatId', "Choose a boat entered at a meeting of one of the series' organisations.");
  try {
    const [row] = await sequelize.query<{ id: string }>(
      `insert into series_race_numbers (series_class_id, boat_id, race_number, assigned_by_id)
       values (:seriesClassId, :boatId, :raceNumber, :actorId) returning id`,
      { replacements: { seriesClassId, ...input, actorId: actor.id }, type: QueryTypes.SELECT },
    );
    return { id: row.id, ...input };
  } catch (e) {
    if (!uniqueViolation(e)) throw e;
    const detail = String((e as { parent?: { constraint?: string } }).parent?.constraint ?? '');
    throw detail.endsWith('_boat')
      ? fieldError('boatId', 'This boat already has a season number in this class.', 409)
      : fieldError('raceNumber', 'This number is already taken in this class this season.', 409);
  }
}
