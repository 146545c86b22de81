import 'server-only';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { SubmitEntryInput } from '@/lib/core/inputs/entries';
import { checkDeclaration, type DeclarationCheck } from '../../core/entries/check-declaration';
import { listMyEntries, type MyEntry } from './list-my-entries';

const STATUS_WORDS: Record<string, string> = {
  draft: 'not open for entries yet',
  entries_closed: 'closed for entries',
  racing: 'racing, and entries are closed',
  finished: 'over',
};

/** A hull or sail number that is a plain race number (1–9999) doubles as the requested number. */
function numberFromHull(hull: string): number | null {
  const n = /^\s*0*(\d{1,4})\s*$/.exec(hull);
  return n && Number(n[1]) >= 1 ? Number(n[1]) : null;
}

/**
 * The entrant enters their own boat into a class at a meeting taking entries. The event row is
 * locked for the transaction, so concurrent entries take race numbers one at a time (the unique
 * index on entries(event_id, race_number) stays the last guard) and entries cannot close midway.
 */
export type SubmittedEntry = {
  entry: MyEntry;
  /** The number asked for (typed, or the boat's plain hull number); null when none was. */
  requestedRaceNumber: number | null;
  gotRequestedNumber: boolean;
  /** What happened to the number, in words the form shows as it is. */
  raceNumberNote: string;
  declarationCheck: DeclarationCheck;
};

export async function submitEntry(actor: Actor | null, raw: unknown): Promise<SubmittedEntry> {
  const input = SubmitEntryInput.parse(raw);
  assertCan(actor, 'entry.submit_own', { eventId: input.eventId });
  const { sequelize, models } = getDb();
  let result: {
    entryId: string;
    requested: number | null;
    raceNumber: number;
    /** The class whose entry already gave this boat its number here (a second class keeps it). */
    keptFrom: string | null;
    gotRequestedNumber: boolean;
    declarationCheck: DeclarationCheck;
  };
  try {
    result = await sequelize.transaction(async (transaction) => {
      const boat = await models.Boat.findOne({ where: { id: input.boatId, ownerId: actor.id }, transaction });
      if (!boat) throw new AppError('not_found', 404, 'No such boat among yours.');
      const event = await models.Event.findByPk(input.eventId, { lock: transaction.LOCK.UPDATE, transaction });
      if (!event) throw new AppError('not_found', 404, 'No such meeting.');
      if (event.status !== 'entries_open') {
        throw new AppError(
          'entries_not_open',
          409,
          `${event.name} is ${STATUS_WORDS[event.status] ?? 'not taking entries'}: no entry was made.`,
        );
      }
      const raceClass = await models.RaceClass.findOne({
        where: { id: input.classId, eventId: event.id },
        transaction,
      });
      if (!raceClass) throw new AppError('not_found', 404, 'No such class at this meeting.');
      const rules = await models.ClassRuleVersion.findOne({
        where: { classId: raceClass.id, status: 'published' },
        order: [
          ['effectiveFrom', 'DESC'],
          ['version', 'DESC'],
        ],
        transaction,
      });
      if (!rules)
        throw new AppError(
          'no_published_rules',
          409,
          `${raceClass.name} has no published rules yet, so it cannot be entered.`,
        );
      // The boat's live entries here: at most one per class, and one class in all unless the meeting allows more.
      const live = await models.Entry.findAll({
        where: { eventId: event.id, boatId: boat.id, status: ['awaiting_payment', 'entered'] },
        order: [['createdAt', 'ASC']],
        transaction,
      });
      const sameClass = live.find((e) => e.classId === raceClass.id);
      if (sameClass)
        throw new AppError(
          'already_entered',
          409,
          `${boat.name} is already entered in ${raceClass.name} at ${event.name} (race number ${sameClass.raceNumber}).`,
        );
      if (live.length > 0 && !event.severalClassesPerBoat)
        throw new AppError(
          'already_entered',
          409,
          `${boat.name} is already entered at ${event.name} (race number ${live[0].raceNumber}), and this meeting takes one class per boat.`,
        );

      // A boat keeps one race number at a meeting: a second class takes the number it already has.
      const kept = live[0]?.raceNumber ?? null;
      const requested = input.requestedRaceNumber ?? numberFromHull(boat.hullNumber);
      // A number is taken when another boat has it here (a withdrawn entry keeps its number from others).
      const taken = async (n: number) =>
        (
          await sequelize.query(
            'select 1 from entries where event_id = :eventId and race_number = :n and boat_id <> :boatId',
            {
              replacements: { eventId: event.id, n, boatId: boat.id },
              type: QueryTypes.SELECT,
              transaction,
            },
          )
        ).length > 0;
      let raceNumber = kept ?? (requested != null && !(await taken(requested)) ? requested : null);
      const gotRequestedNumber = raceNumber != null && raceNumber === requested;
      if (raceNumber == null) {
        // "The next free one": the first free number after the one asked for (wrapping round to
        // the lowest free number past 9999); with nothing asked for, the lowest free number.
        const [free] = await sequelize.query<{ n: number }>(
          `select n from generate_series(1, 9999) n
            where not exists (select 1 from entries e where e.event_id = :eventId and e.race_number = n)
            order by (n <= :after), n limit 1`,
          { replacements: { eventId: event.id, after: requested ?? 0 }, type: QueryTypes.SELECT, transaction },
        );
        if (!free) throw new AppError('no_race_numbers', 409, 'Every race number at this meeting is taken.');
        raceNumber = free.n;
      }
      const entry = await models.Entry.create(
        {
          eventId: event.id,
          classId: raceClass.id,
          boatId: boat.id,
          entrantId: actor.id,
          raceNumber,
          feeMinor: event.entryFeeMinor,
          currency: event.currency,
        },
        { transaction },
      );
      return {
        entryId: entry.id,
        requested,
        raceNumber,
        keptFrom: kept != null ? live[0].classId : null,
        gotRequestedNumber: requested != null && gotRequestedNumber,
        declarationCheck: checkDeclaration(boat, rules.rules),
      };
    });
  } catch (err) {
    // Only reachable if the lock were bypassed: the unique indexes still refuse a double entry.
    if (err instanceof UniqueConstraintError)
      throw new AppError('conflict', 409, 'This boat or race number was just taken at this meeting; try again.');
    throw err;
  }
  const [entry] = await listMyEntries(actor, { entryId: result.entryId });
  const { requested, raceNumber } = result;
  const raceNumberNote =
    result.keptFrom != null
      ? `${entry.boatName} keeps race number ${raceNumber} in every class at this meeting.`
      : requested == null
        ? `You did not ask for a number, so you have ${raceNumber}, the lowest free one.`
        : result.gotRequestedNumber
          ? `You have the number you asked for: ${raceNumber}.`
          : `Race number ${requested} is already taken at this meeting, so you have ${raceNumber}, the next free number${raceNumber < requested ? ' (none was free above it)' : ''}.`;
  return {
    entry,
    requestedRaceNumber: requested,
    gotRequestedNumber: result.gotRequestedNumber,
    raceNumberNote,
    declarationCheck: result.declarationCheck,
  };
}
