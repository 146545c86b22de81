'use strict';
// Demo scenario (invented): the Sprint Sport class ran two timed 400 m acceleration runs per boat on the
// Kelda Reach straight, with GPS loggers on most boats and a speed trap for two of them, so "Model against
// the clock" has something to compare. The times follow each boat's declared power and weight with a little
// invented run-to-run scatter; they are not measurements. Seeding twice changes nothing (the import key).
const { ids } = require('./20261201000100-demo-people-and-meeting.js');

const SS = '0b0e0000-0000-4000-8101-000000000001';

module.exports = {
  async up(queryInterface) {
    const q = queryInterface.sequelize;
    const [done] = await q.query('select 1 from run_times where class_id = :cls limit 1', {
      replacements: { cls: SS },
    });
    if (done.length) return;
    const [entries] = await q.query(
      `select e.id, e.race_number, b.declared_power_kw as power, b.declared_weight_kg as weight
         from entries e join boats b on b.id = e.boat_id
        where e.event_id = :meeting and e.class_id = :cls and e.status = 'entered' order by e.race_number`,
      { replacements: { meeting: ids.meeting, cls: SS } },
    );
    const rows = [];
    entries.forEach((e, i) => {
      // Invented: time over 400 m grows as (weight / power)^(1/3), scaled to about 16 s for the class's middle boat.
      const base = 16 * Math.cbrt((Number(e.weight) + 185) / Number(e.power) / (870 / 225));
      for (const [k, run] of ['1', '2'].entries()) {
        const scatter = (((i * 7 + k * 3) % 5) - 2) * 0.06;
        const speedKmh = 360 / base + 85 - k * 0.8;
        rows.push({
          event_id: ids.meeting,
          class_id: SS,
          entry_id: e.id,
          race_number: e.race_number,
          run_label: run,
          course_length_m: 400,
          elapsed_s: Math.round((base + scatter) * 1000) / 1000,
          trap_speed_ms: i % 4 === 1 ? Math.round(((speedKmh - 2) / 3.6) * 100) / 100 : null,
          gps_top_speed_ms: i % 4 === 1 || i === entries.length - 1 ? null : Math.round((speedKmh / 3.6) * 100) / 100,
          rpm: null,
          conditions: k === 0 ? 'calm, 14 °C' : 'light tailwind',
          source: 'csv',
          recorded_by_id: ids.organiser,
        });
      }
    });
    if (rows.length) await queryInterface.bulkInsert('run_times', rows);
  },
  async down() {
    // Run times are append-only (their trigger refuses deletes): dropping the demo database removes them.
  },
};
