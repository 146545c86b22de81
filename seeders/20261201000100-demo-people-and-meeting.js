'use strict';
// Demo scenario (invented): the Tarnwater Jet Sprint Club, its spring meeting at Kelda Reach,
// and one person per role. Every row has a fixed id and is inserted "on conflict do nothing",
// so seeding twice changes nothing.
const bcrypt = require('bcryptjs');

const DEMO_PASSWORD = 'tarnwater-demo';
const ids = {
  club: '0b0e0000-0000-4000-8000-000000000001',
  meeting: '0b0e0000-0000-4000-8000-000000000101',
  admin: '0b0e0000-0000-4000-8000-000000001001',
  organiser: '0b0e0000-0000-4000-8000-000000001002',
  chief: '0b0e0000-0000-4000-8000-000000001003',
  scrutineer: '0b0e0000-0000-4000-8000-000000001004',
  steward: '0b0e0000-0000-4000-8000-000000001005',
  entrant: '0b0e0000-0000-4000-8000-000000001006',
};
const people = [
  { id: ids.admin, name: 'Sabine Corrow', email: 'admin@boreline.example', is_admin: true },
  { id: ids.organiser, name: 'Maren Holt', email: 'organiser@tarnwater.example', is_admin: false },
  { id: ids.chief, name: 'Idris Penhale', email: 'chief@tarnwater.example', is_admin: false },
  { id: ids.scrutineer, name: 'Tove Aldana', email: 'scrutineer@tarnwater.example', is_admin: false },
  { id: ids.steward, name: 'Rufus Okafor-Lind', email: 'steward@tarnwater.example', is_admin: false },
  { id: ids.entrant, name: 'Cass Whitcombe', email: 'entrant@tarnwater.example', is_admin: false },
];

async function insertIgnore(queryInterface, table, rows) {
  if (rows.length === 0) return;
  const cols = Object.keys(rows[0]);
  const values = rows.map((r) => `(${cols.map((c) => queryInterface.sequelize.escape(r[c])).join(', ')})`).join(',\n');
  await queryInterface.sequelize.query(
    `insert into ${table} (${cols.join(', ')}) values ${values} on conflict do nothing`,
  );
}

module.exports = {
  DEMO_PASSWORD,
  ids,
  insertIgnore,
  async up(queryInterface) {
    const hash = bcrypt.hashSync(DEMO_PASSWORD, 10);
    await insertIgnore(
      queryInterface,
      'users',
      people.map((p) => ({ ...p, password_hash: hash, email_verified: new Date() })),
    );
    await insertIgnore(queryInterface, 'organisations', [
      { id: ids.club, name: 'Tarnwater Jet Sprint Club', slug: 'tarnwater-jsc' },
    ]);
    await insertIgnore(queryInterface, 'organisation_members', [
      {
        id: '0b0e0000-0000-4000-8000-000000002001',
        organisation_id: ids.club,
        user_id: ids.organiser,
        role: 'organiser',
      },
    ]);
    await insertIgnore(queryInterface, 'events', [
      {
        id: ids.meeting,
        organisation_id: ids.club,
        name: 'Kelda Reach Spring Sprint',
        slug: 'kelda-reach-spring-sprint',
        venue: 'Kelda Reach, Harrowdale',
        starts_on: '2027-03-13',
        ends_on: '2027-03-14',
        time_zone: 'Pacific/Auckland',
        status: 'entries_open',
      },
    ]);
    await insertIgnore(queryInterface, 'event_staff', [
      { id: '0b0e0000-0000-4000-8000-000000003001', event_id: ids.meeting, user_id: ids.organiser, role: 'organiser' },
      {
        id: '0b0e0000-0000-4000-8000-000000003002',
        event_id: ids.meeting,
        user_id: ids.chief,
        role: 'chief_scrutineer',
      },
      { id: '0b0e0000-0000-4000-8000-000000003003', event_id: ids.meeting, user_id: ids.chief, role: 'scrutineer' },
      {
        id: '0b0e0000-0000-4000-8000-000000003004',
        event_id: ids.meeting,
        user_id: ids.scrutineer,
        role: 'scrutineer',
      },
      { id: '0b0e0000-0000-4000-8000-000000003005', event_id: ids.meeting, user_id: ids.steward, role: 'steward' },
    ]);
  },
  async down(queryInterface) {
    await queryInterface.bulkDelete('organisations', { id: ids.club });
    await queryInterface.bulkDelete('users', { id: Object.values(ids) });
  },
};
