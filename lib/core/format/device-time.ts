// Times on the phone's own clock, for screens that only say "when, here and now" (the boat card's history, the
// phone's outbox, the inspection board's latest record). Built from the Date's own fields, in the house's
// 24-hour style ("4 Apr, 14:05"; lib/core/format/time.ts gives the meeting's zone instead): no date-fns, as
// this module is part of the dock's first load, and no Intl.DateTimeFormat, whose first use with options on
// a phone (the browser building its date patterns) cost longer than drawing the whole boat card.

export const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const two = (n: number) => String(n).padStart(2, '0');

export type DeviceTimeShape = 'day-time' | 'time';

/** "4 Apr, 14:05" (day-time) or "14:05" (time), on this device's clock; "" for a value that is not a date. */
export function formatOnDevice(instant: Date | string | number, shape: DeviceTimeShape): string {
  const d = new Date(instant);
  if (Number.isNaN(d.getTime())) return '';
  const time = `${two(d.getHours())}:${two(d.getMinutes())}`;
  return shape === 'time' ? time : `${d.getDate()} ${MONTHS[d.getMonth()]}, ${time}`;
}
