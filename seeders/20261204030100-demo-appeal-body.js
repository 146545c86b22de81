'use strict';
// Demo scenario (invented): one member of the governing body's appeal body (a role above any single meeting),
// the Kelda Reach meeting's appeal fee, and a short penalty catalogue for it. Seeding twice changes nothing.
const bcrypt = require('bcryptjs');
const { DEMO_PASSWORD, ids, insertIgnore } = require('./20261201000100-demo-people-and-meeting.js');

const APPEAL_BODY = '0b0e0000-0000-4000-8000-000000001007';
const item = (n) => `0b0e0000-0000-4000-8131-00000000000${n}`;

module.exports = {
  async up(queryInterface) {
    await insertIgnore(queryInterface, 'users', [
      {
        id: APPEAL_BODY,
        name: 'Ilse Marrowby',
        email: 'appeals@boreline.example',
        is_admin: false,
        password_hash: bcrypt.hashSync(DEMO_PASSWORD, 10),
        email_verified: new Date(),
      },
    ]);
    await insertIgnore(queryInterface, 'appeal_body_members', [
      { id: '0b0e0000-0000-4000-8000-000000004001', user_id: APPEAL_BODY, appointed_by_id: ids.admin },
    ]);
    await queryInterface.sequelize.query(
      `update events set appeal_fee_minor = 10000 where id = :id and appeal_fee_minor = 0`,
      { replacements: { id: ids.meeting } },
    );
    const base = { event_id: ids.meeting, created_by_id: ids.organiser };
    await insertIgnore(queryInterface, 'penalty_catalogue_items', [
      {
        ...base,
        id: item(1),
        code: 'W1',
        kind: 'warning',
        amount: null,
        label: 'Written warning',
        rule_reference: 'KR 4.1',
      },
      {
        ...base,
        id: item(2),
        code: 'T5',
        kind: 'time_added',
        amount: 5,
        label: 'Five seconds added',
        rule_reference: 'KR 4.2',
      },
      {
        ...base,
        id: item(3),
        code: 'P3',
        kind: 'places_deducted',
        amount: 3,
        label: 'Three places deducted',
        rule_reference: 'KR 4.3',
      },
      {
        ...base,
        id: item(4),
        code: 'R1',
        kind: 'run_disqualification',
        amount: null,
        label: 'Run struck out',
        rule_reference: 'KR 4.4',
      },
      {
        ...base,
        id: item(5),
        code: 'DSQ',
        kind: 'meeting_disqualification',
        amount: null,
        label: 'Disqualified from the meeting',
        rule_reference: 'KR 4.5',
      },
    ]);
  },
  async down(queryInterface) {
    await queryInterface.sequelize.query(`delete from appeal_body_members where user_id = :id`, {
      replacements: { id: APPEAL_BODY },
    });
  },
};
