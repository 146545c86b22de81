import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { DeclareInterestInput } from '../../core/inputs/interests';
import { queryInterests, type InterestView } from './interest-view';

/**
 * An official declares an interest at their meeting: in a boat or an entrant of that meeting, or
 * in a named team. The declaration is append-only (the database refuses edits); a second standing
 * declaration about the same boat or person is refused (409) rather than doubled.
 */
export async function declareInterest(actor: Actor | null, eventId: string, raw: unknown): Promise<InterestView> {
  assertCan(actor, 'interest.declare', { eventId });
  const input = DeclareInterestInput.parse(raw);
  const { models, sequelize } = getDb();
  return sequelize.transaction(async (transaction) => {
    const subject = {
      boatId: null as string | null,
      entrantId: null as string | null,
      teamName: null as string | null,
    };
    if (input.kind === 'boat') {
      subject.boatId = input.boatId.toLowerCase();
      const entered = await models.Entry.count({ where: { eventId, boatId: subject.boatId }, transaction });
      if (!entered) throw fieldError('boatId', 'Choose a boat entered at this meeting.');
    } else if (input.kind === 'entrant') {
      subject.entrantId = input.entrantId.toLowerCase();
      const entered = await models.Entry.count({ where: { eventId, entrantId: subject.entrantId }, transaction });
      if (!entered) throw fieldError('entrantId', 'Choose an entrant of this meeting.');
    } else {
      subject.teamName = input.teamName;
    }
    // One standing declaration per subject: serialise this official's declarations at this meeting.
    await sequelize.query('select pg_advisory_xact_lock(hashtext(:key))', {
      replacements: { key: `interest:${eventId}:${actor.id}` },
      transaction,
    });
    const [{ n }] = await sequelize.query<{ n: number }>(
      `select count(*)::int as n from official_interests i
        where i.event_id = :eventId and i.official_id = :officialId and i.subject_kind = :kind
          and (i.boat_id = :boatId or i.entrant_id = :entrantId or lower(i.team_name) = lower(:teamName))
          and not exists (select 1 from official_interest_withdrawals w where w.interest_id = i.id)`,
      {
        replacements: { eventId, officialId: actor.id, kind: input.kind, ...subject },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    if (n > 0)
      throw new AppError(
        'already_declared',
        409,
        'You have already declared a standing interest in this: withdraw it first if the statement should change.',
        [
          {
            field: input.kind === 'boat' ? 'boatId' : input.kind === 'entrant' ? 'entrantId' : 'teamName',
            message: 'Already declared.',
          },
        ],
      );
    const made = await models.OfficialInterest.create(
      { eventId, officialId: actor.id, subjectKind: input.kind, ...subject, statement: input.statement },
      { transaction },
    );
    const [view] = await queryInterests(eventId, { interestId: made.id, transaction });
    return view;
  });
}
