import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { OpenSlotInput } from '@/lib/core/inputs/schedule';
import { isOnMeetingDays, slotInstant } from '@/lib/core/schedule/slot-times';
import { readSlots, type SlotView } from './slot-view';

/** The chief scrutineer opens a slot: a class, a bay, a start in the meeting's zone, a length and a capacity. */
export async function openSlot(actor: Actor | null, eventId: string, raw: unknown): Promise<SlotView> {
  assertCan(actor, 'schedule.manage', { eventId });
  const input = OpenSlotInput.parse(raw);
  const { models } = getDb();
  const event = await models.Event.findByPk(eventId, { attributes: ['id', 'startsOn', 'endsOn', 'timeZone'] });
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const raceClass = await models.RaceClass.findOne({ where: { id: input.classId, eventId }, attributes: ['id'] });
  if (!raceClass) throw fieldError('classId', 'Choose a class of this meeting.');
  const startsAt = slotInstant(input.startsAt, event.timeZone);
  if (!startsAt)
    throw fieldError('startsAt', `That time does not exist in ${event.timeZone} (the clocks skip it): choose another.`);
  const endsAt = new Date(startsAt.getTime() + input.durationMinutes * 60_000);
  const meeting = { startsOn: event.startsOn, endsOn: event.endsOn, timeZone: event.timeZone };
  if (!isOnMeetingDays(startsAt, meeting) || !isOnMeetingDays(new Date(endsAt.getTime() - 1), meeting))
    throw fieldError(
      'startsAt',
      `The slot must fall on the meeting's days (${event.startsOn} to ${event.endsOn}, ${event.timeZone}).`,
    );
  const slot = await models.InspectionSlot.create({
    eventId,
    classId: input.classId,
    bay: input.bay,
    startsAt,
    endsAt,
    capacity: input.capacity,
    graceMinutes: input.graceMinutes,
    createdById: actor.id,
  });
  const [view] = (await readSlots(eventId)).filter((s) => s.id === slot.id);
  return view;
}
