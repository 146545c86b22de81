'use strict';
// Demo scenario (invented): the Tarnwater club's "Fellside Sprint Series 2027", run by the demo organiser as
// its secretary with the demo steward as its steward. Its Sprint Sport class takes the Kelda Reach meeting's
// Sprint Sport class as its first round; the points table and the one dropped round are invented. One
// technical bulletin is on record (seeded without mail: nobody is e-mailed by seeding). No series rules
// version is seeded, so nothing changes a meeting's class rules. Seeding twice changes nothing.
const { ids, insertIgnore } = require('./20261201000100-demo-people-and-meeting.js');

const SERIES = '0b0e0000-0000-4000-8161-000000000001';
const SERIES_CLASS = '0b0e0000-0000-4000-8161-000000000101';
const SS = '0b0e0000-0000-4000-8101-000000000001'; // the meeting's Sprint Sport class

module.exports = {
  SERIES,
  SERIES_CLASS,
  async up(queryInterface) {
    await insertIgnore(queryInterface, 'series', [
      { id: SERIES, name: 'Fellside Sprint Series', season: 2027, created_by_id: ids.organiser },
    ]);
    await insertIgnore(queryInterface, 'series_organisations', [{ series_id: SERIES, organisation_id: ids.club }]);
    await insertIgnore(queryInterface, 'series_officials', [
      {
        id: '0b0e0000-0000-4000-8161-000000000201',
        series_id: SERIES,
        user_id: ids.organiser,
        role: 'series_secretary',
        appointed_by_id: ids.organiser,
      },
      {
        id: '0b0e0000-0000-4000-8161-000000000202',
        series_id: SERIES,
        user_id: ids.steward,
        role: 'series_steward',
        appointed_by_id: ids.organiser,
      },
    ]);
    await insertIgnore(queryInterface, 'series_classes', [
      {
        id: SERIES_CLASS,
        series_id: SERIES,
        code: 'SS',
        name: 'Sprint Sport',
        points_by_position: JSON.stringify([25, 20, 16, 13, 11, 10, 9, 8, 7, 6, 5, 4, 3, 2, 1]),
        dropped_rounds: 1,
      },
    ]);
    await queryInterface.sequelize.query(
      `update race_classes set series_class_id = :sc where id = :cls and series_class_id is null`,
      { replacements: { sc: SERIES_CLASS, cls: SS } },
    );
    const [[{ n }]] = await queryInterface.sequelize.query(
      `select count(distinct entrant_id)::int as n from entries where class_id = :cls and status in ('awaiting_payment', 'entered')`,
      { replacements: { cls: SS } },
    );
    await insertIgnore(queryInterface, 'series_bulletins', [
      {
        id: '0b0e0000-0000-4000-8161-000000000301',
        series_class_id: SERIES_CLASS,
        number: 1,
        title: 'Kill-switch lanyard length',
        body: 'From the first round the kill-switch lanyard must stop the engine before the driver leaves the seat. Scrutineers will check it at the dock.',
        effective_from: '2027-01-01',
        published_by_id: ids.organiser,
        recipient_count: n,
      },
    ]);
  },
  async down(queryInterface) {
    // Bulletins are append-only (their trigger refuses deletes): dropping the demo database removes them.
    await queryInterface.sequelize.query(`update race_classes set series_class_id = null where series_class_id = :sc`, {
      replacements: { sc: SERIES_CLASS },
    });
  },
};
