import 'server-only';
import { randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { CreateEventInput, EventInput } from '@/lib/core/inputs/events';
import { toEventDto } from './event-dto';

const slugify = (name: string) =>
  name
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 60) || 'meeting';

/** An organiser of a club creates a meeting and becomes its organiser. */
export async function createEvent(actor: Actor | null, raw: unknown) {
  // Refuse people who organise nowhere before reading their input; then check the named club.
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  if (!actor.isAdmin && actor.organiserOf.length === 0)
    throw new AppError('forbidden', 403, 'You are not allowed to do this.');
  const input = CreateEventInput.parse(raw);
  assertCan(actor, 'event.create', { organisationId: input.organisationId });
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (transaction) => {
    const { organisationId, ...fields } = withoutUndefined(input);
    const event = await models.Event.create(
      {
        ...fields,
        severalClassesPerBoat: fields.severalClassesPerBoat ?? false,
        organisationId,
        slug: `${slugify(input.name)}-${randomBytes(3).toString('hex')}`,
      },
      { transaction },
    );
    await models.EventStaff.create({ eventId: event.id, userId: actor.id, role: 'organiser' }, { transaction });
    return toEventDto(event);
  });
}

/** A field an older client leaves out (the appeal fee) keeps its stored value or the column's default. */
function withoutUndefined<T extends Record<string, unknown>>(input: T): T {
  return Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined)) as T;
}

/** The event's organiser edits its details. */
export async function updateEvent(actor: Actor | null, eventId: string, raw: unknown) {
  assertCan(actor, 'event.edit', { eventId });
  const { severalClassesPerBoat, ...input } = withoutUndefined(EventInput.parse(raw));
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (transaction) => {
    // The event row's lock: an entry into a second class (which locks it too) cannot slip past the check below.
    const event = await models.Event.findByPk(eventId, { lock: transaction.LOCK.UPDATE, transaction });
    if (!event) throw new AppError('not_found', 404, 'No such event.');
    if (severalClassesPerBoat === false && event.severalClassesPerBoat) {
      const [row] = await sequelize.query<{ boats: number }>(
        `select count(*)::int as boats from (select boat_id from entries
           where event_id = :eventId and status in ('awaiting_payment', 'entered')
           group by boat_id having count(*) > 1) b`,
        { replacements: { eventId }, type: QueryTypes.SELECT, transaction },
      );
      if (row.boats > 0)
        throw new AppError(
          'several_classes_in_use',
          409,
          `${row.boats === 1 ? 'One boat is' : `${row.boats} boats are`} entered in more than one class here: withdraw or cancel the extra entries before allowing one class per boat. Nothing was saved.`,
          [{ field: 'severalClassesPerBoat', message: 'Boats are entered in more than one class.' }],
        );
    }
    await event.update(severalClassesPerBoat === undefined ? input : { ...input, severalClassesPerBoat }, {
      transaction,
    });
    return toEventDto(event);
  });
}

/** One event for its organiser (403 for anyone else, 404 if it does not exist). */
export async function getEventForOrganiser(actor: Actor | null, eventId: string) {
  assertCan(actor, 'event.edit', { eventId });
  const event = await getDb().models.Event.findByPk(eventId);
  if (!event) throw new AppError('not_found', 404, 'No such event.');
  return toEventDto(event);
}
