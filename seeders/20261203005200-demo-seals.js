'use strict';
// Demo scenario (invented): a batch of numbered seals issued to the Kelda Reach meeting, and two of
// them applied to the engines of two demo boats at an earlier check. The components are registered
// here only when the boat has none of that kind (another seeder may register components too); each
// row has a fixed id, so seeding twice changes nothing. Seeders are plain CommonJS (sequelize-cli), so
// the rows are written as the models define them, with SQL.
const { ids, insertIgnore } = require('./20261201000100-demo-people-and-meeting.js');

const uuid = (group, n) => `0b0e0000-0000-4000-8${group}-${String(n).padStart(12, '0')}`;
const BATCH = uuid('520', 1);
const PREFIX = 'KR-';
const FIRST = 1;
const LAST = 60;
// Two demo boats (the second and third of the demo entries) and an engine for each.
const SEALED = [
  {
    boat: uuid('301', 2),
    component: uuid('521', 1),
    serial: 'DEMO-EN-2041',
    seal: 'KR-01',
    position: 'rocker cover bolt, port side',
  },
  {
    boat: uuid('301', 3),
    component: uuid('521', 2),
    serial: 'DEMO-EN-3307',
    seal: 'KR-02',
    position: 'sump drain plug',
  },
];

module.exports = {
  async up(queryInterface) {
    const q = queryInterface.sequelize;
    await insertIgnore(queryInterface, 'seal_batches', [
      {
        id: BATCH,
        event_id: ids.meeting,
        prefix: PREFIX,
        first_number: FIRST,
        last_number: LAST,
        note: 'Chief scrutineer’s seal bag, dock kit A',
        issued_by_id: ids.chief,
        created_at: new Date(Date.UTC(2026, 10, 20, 8, 0)),
      },
    ]);
    const width = String(LAST).length;
    const seals = [];
    for (let n = FIRST; n <= LAST; n++)
      seals.push({ batch_id: BATCH, number: `${PREFIX}${String(n).padStart(width, '0')}` });
    // The unique index on upper(number) makes a second run a no-op.
    await insertIgnore(queryInterface, 'seals', seals);

    for (const s of SEALED) {
      const [[existing]] = await q.query(
        `select id from boat_components where boat_id = :boat and kind = 'engine' order by created_at limit 1`,
        { replacements: { boat: s.boat } },
      );
      const [[boat]] = await q.query('select id from boats where id = :boat', { replacements: { boat: s.boat } });
      if (!boat) continue; // the demo boats seeder did not run
      let componentId = existing ? existing.id : null;
      if (!componentId) {
        await insertIgnore(queryInterface, 'boat_components', [
          {
            id: s.component,
            kind: 'engine',
            maker: 'Harrowgate',
            model: 'HV-6.2',
            serial_number: s.serial,
            boat_id: s.boat,
            created_by_id: ids.scrutineer,
          },
        ]);
        await insertIgnore(queryInterface, 'component_events', [
          {
            id: uuid('522', SEALED.indexOf(s) + 1),
            component_id: s.component,
            action: 'registered',
            boat_id: s.boat,
            recorded_by_id: ids.scrutineer,
          },
        ]);
        componentId = s.component;
      }
      const [[seal]] = await q.query('select id from seals where upper(number) = :number', {
        replacements: { number: s.seal },
      });
      await insertIgnore(queryInterface, 'seal_events', [
        {
          id: uuid('523', SEALED.indexOf(s) + 1),
          seal_id: seal.id,
          action: 'applied',
          component_id: componentId,
          boat_id: s.boat,
          event_id: ids.meeting,
          position: s.position,
          recorded_by_id: ids.scrutineer,
          created_at: new Date(Date.UTC(2026, 10, 21, 9, 30 + SEALED.indexOf(s) * 10)),
        },
      ]);
    }
  },
  async down() {
    // Seals and their events are append-only: nothing is taken back.
  },
};
