'use strict';
// Demo scenario (invented): the chief scrutineer's slots for the first morning at Kelda Reach (two bays,
// half an hour each, three boats a slot), two Sprint Sport entries booked into them, and one incident
// the chief scrutineer noted: a boat that stalled on the start line and was towed in, no damage found.
// Seeding twice changes nothing.
const { ids } = require('./20261201000100-demo-people-and-meeting.js');

const SS = '0b0e0000-0000-4000-8101-000000000001';
const slot = (n) => `0b0e0000-0000-4000-8121-00000000000${n}`;
// 2027-03-13 is in New Zealand daylight time (UTC+13:00): 08:00 there is 19:00 UTC the day before.
const at = (hhmm) => {
  const [h, m] = hhmm.split(':').map(Number);
  return new Date(Date.UTC(2027, 2, 12, 19 + h - 8, m));
};

module.exports = {
  async up(queryInterface) {
    const q = queryInterface.sequelize;
    const [done] = await q.query('select 1 from inspection_slots where id = :id', { replacements: { id: slot(1) } });
    if (done.length) return;
    const slots = [
      [1, 'North bay', '08:00'],
      [2, 'South bay', '08:00'],
      [3, 'North bay', '08:30'],
      [4, 'South bay', '08:30'],
    ].map(([n, bay, time]) => ({
      id: slot(n),
      event_id: ids.meeting,
      class_id: SS,
      bay,
      starts_at: at(time),
      ends_at: new Date(at(time).getTime() + 30 * 60_000),
      capacity: 3,
      grace_minutes: 10,
      created_by_id: ids.chief,
    }));
    await queryInterface.bulkInsert('inspection_slots', slots);
    const [entries] = await q.query(
      `select e.id, e.entrant_id from entries e where e.event_id = :meeting and e.class_id = :cls and e.status = 'entered'
        order by e.race_number limit 3`,
      { replacements: { meeting: ids.meeting, cls: SS } },
    );
    if (entries.length >= 2)
      await queryInterface.bulkInsert('slot_bookings', [
        { event_id: ids.meeting, slot_id: slot(1), entry_id: entries[0].id, booked_by_id: entries[0].entrant_id },
        { event_id: ids.meeting, slot_id: slot(2), entry_id: entries[1].id, booked_by_id: ids.chief },
      ]);
    if (entries.length >= 3)
      await queryInterface.bulkInsert('incidents', [
        {
          event_id: ids.meeting,
          entry_id: entries[2].id,
          occurred_at: at('11:20'),
          description:
            'Stalled on the start line in the second run and was towed back to the pits. Checked at the dock: no damage found.',
          damage: false,
          recorded_by_id: ids.chief,
        },
      ]);
  },
  async down() {
    // Bookings and incidents are append-only (their triggers refuse deletes): dropping the demo database removes them.
  },
};
