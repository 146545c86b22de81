import 'server-only';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { RecordIncidentInput } from '@/lib/core/inputs/incidents';
import { isOnMeetingDays } from '@/lib/core/schedule/slot-times';
import { incidentTaskReason } from '@/lib/core/incidents/incident-task';
import { readIncidents, type IncidentView } from './incident-view';

const FUTURE_SLACK_MS = 5 * 60_000;

/**
 * The organiser or the chief scrutineer records an incident (or a correction of one, as a new row).
 * Damage makes a re-inspection mandatory before the boat's next run: in the same transaction as the
 * incident, the entry's open re-inspection task is joined, or a task is opened, and the incident names
 * it (so the boat's history links the two, and an incident with damage never stands without its task).
 * The task is opened here rather than through requestReinspection: the organiser records incidents but
 * does not set re-inspections at will (inspection.assign_reinspection), and the two must commit together.
 * A correction that drops the damage leaves the task: the officials close it by inspecting the boat.
 */
export async function recordIncident(actor: Actor | null, eventId: string, raw: unknown): Promise<IncidentView> {
  assertCan(actor, 'incident.record', { eventId });
  const input = RecordIncidentInput.parse(raw);
  const { models, sequelize } = getDb();
  const event = await models.Event.findByPk(eventId, { attributes: ['startsOn', 'endsOn', 'timeZone'] });
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const occurredAt = new Date(input.occurredAt);
  if (occurredAt.getTime() > Date.now() + FUTURE_SLACK_MS)
    throw fieldError('occurredAt', 'An incident cannot be recorded before it happens.');
  if (!isOnMeetingDays(occurredAt, event))
    throw fieldError(
      'occurredAt',
      `The incident must fall on the meeting's days (${event.startsOn} to ${event.endsOn}, ${event.timeZone}).`,
    );
  const entry = await models.Entry.findOne({
    where: { id: input.entryId, eventId },
    attributes: ['id', 'entrantId', 'boatId'],
  });
  if (!entry) throw fieldError('entryId', 'Choose a boat entered at this meeting.');
  const boat = await models.Boat.findByPk(entry.boatId, { attributes: ['ownerId'] });
  if (entry.entrantId === actor.id || boat?.ownerId === actor.id)
    throw new AppError('own_boat', 403, 'You cannot record an incident of a boat you entered or own.');

  try {
    const id = await sequelize.transaction(async (transaction) => {
      // The entry's row lock: two incidents of one boat at once join or open one task, one after the other.
      await sequelize.query('select id from entries where id = :entryId for update', {
        replacements: { entryId: entry.id },
        transaction,
      });
      if (input.supersedesId) {
        const [earlier] = await sequelize.query<{ entryId: string; isCurrent: boolean }>(
          `select entry_id as "entryId", not exists (select 1 from incidents x where x.supersedes_id = i.id) as "isCurrent"
             from incidents i where i.id = :id and i.event_id = :eventId`,
          { replacements: { id: input.supersedesId, eventId }, type: QueryTypes.SELECT, transaction },
        );
        if (!earlier) throw fieldError('supersedesId', 'Name an incident of this meeting.');
        if (earlier.entryId !== entry.id)
          throw fieldError('supersedesId', 'A correction is about the same boat as the record it corrects.');
        if (!earlier.isCurrent)
          throw new AppError('already_corrected', 409, 'That record was already corrected: correct the newest one.');
      }
      let reinspectionId: string | null = null;
      if (input.damage) {
        const open = await models.Reinspection.findOne({
          where: { eventId, entryId: entry.id, doneAt: null, protestId: null }, // a protest's task may check only part of the boat
          attributes: ['id'],
          order: [['createdAt', 'ASC']],
          transaction,
        });
        reinspectionId =
          open?.id ??
          (
            await models.Reinspection.create(
              {
                eventId,
                entryId: entry.id,
                reason: incidentTaskReason(occurredAt, event.timeZone, input.description),
                requestedById: actor.id,
              },
              { transaction },
            )
          ).id;
      }
      if (input.damage) {
        // The same boat entered in other classes here (a meeting may allow several): damage is the boat's, so
        // each class's entry must be inspected again too, under its own rules, before the boat's next run.
        const siblings = await sequelize.query<{ id: string }>(
          `select e.id from entries e
            where e.event_id = :eventId and e.boat_id = :boatId and e.id <> :entryId
              and e.status in ('awaiting_payment', 'entered')
              and not exists (select 1 from reinspections r
                               where r.entry_id = e.id and r.done_at is null and r.protest_id is null)
            order by e.id for update`,
          { replacements: { eventId, boatId: entry.boatId, entryId: entry.id }, type: QueryTypes.SELECT, transaction },
        );
        for (const sibling of siblings)
          await models.Reinspection.create(
            {
              eventId,
              entryId: sibling.id,
              reason: incidentTaskReason(occurredAt, event.timeZone, input.description),
              requestedById: actor.id,
            },
            { transaction },
          );
      }
      const row = await models.Incident.create(
        {
          eventId,
          entryId: entry.id,
          occurredAt,
          description: input.description,
          damage: input.damage,
          reinspectionId,
          supersedesId: input.supersedesId,
          correctionReason: input.correctionReason,
          recordedById: actor.id,
        },
        { transaction },
      );
      return row.id;
    });
    const [view] = await readIncidents({ eventId, id });
    return view;
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw new AppError('already_corrected', 409, 'That record was corrected a moment ago: correct the newest one.');
    throw err;
  }
}
