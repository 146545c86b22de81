'use strict';
// Demo scenario (invented people, bodies and serials): crews and dated gear on three boats of the
// meeting, so the entrant's screen, the dock and the board show them. Cass's boat (#10) is in order,
// with a navigator of 15 whose guardian consented; #13's driver brings a helmet that expired before the
// meeting; #16's driver holds a grade the meeting does not accept. Each class's own
// required safety items come from its published rules. The meeting accepts grades A and B,
// and Group Pro asks for a navigator. Seeding twice changes nothing.
const { ids, insertIgnore } = require('./20261201000100-demo-people-and-meeting.js');

const uuid = (group, n) => `0b0e0000-0000-4000-8${group}-${String(n).padStart(12, '0')}`;
const entry = (n) => uuid('401', n);
const member = (n) => uuid('501', n);
const item = (n) => uuid('502', n);
const GP = uuid('101', 2);

const LICENCE_BODY = 'Harrowdale Powerboat Council';

module.exports = {
  async up(queryInterface) {
    const [present] = await queryInterface.sequelize.query('select 1 from entries where id = :id', {
      replacements: { id: entry(1) },
    });
    if (!present.length) return;
    await insertIgnore(queryInterface, 'crew_requirements', [
      {
        id: uuid('503', 1),
        event_id: ids.meeting,
        class_id: null,
        accepted_licence_grades: '["A","B"]',
        navigator_required: false,
        updated_by_id: ids.organiser,
      },
      {
        id: uuid('503', 2),
        event_id: ids.meeting,
        class_id: GP,
        accepted_licence_grades: '["A","B"]',
        navigator_required: true,
        updated_by_id: ids.organiser,
      },
    ]);
    const person = (n, entryN, position, role, name, bornOn, grade, number, extra = {}) => ({
      id: member(n),
      entry_id: entry(entryN),
      position,
      role,
      user_id: null,
      name,
      born_on: bornOn,
      licence_issued_by: LICENCE_BODY,
      licence_grade: grade,
      licence_number: number,
      licence_expires_on: '2027-11-30',
      medical_expires_on: '2027-09-30',
      guardian_name: null,
      guardian_consent_on: null,
      ...extra,
    });
    await insertIgnore(queryInterface, 'entry_crew_members', [
      person(1, 1, 0, 'driver', 'Cass Whitcombe', '1988-04-02', 'B', 'HPC-B-20417', { user_id: ids.entrant }),
      person(2, 1, 1, 'navigator', 'Ellis Whitcombe', '2011-08-19', 'A', 'HPC-J-31188', {
        guardian_name: 'Cass Whitcombe',
        guardian_consent_on: '2026-11-28',
      }),
      person(3, 2, 0, 'driver', 'Piripi Askew', '1979-12-11', 'A', 'HPC-A-10932'),
      person(4, 2, 1, 'navigator', 'Hana Lowe', '1994-06-30', 'B', 'HPC-B-22045'),
      person(5, 3, 0, 'driver', 'Dorian Vell', '1985-02-17', 'C', 'HPC-C-40077'),
    ]);
    const gear = (n, entryN, memberN, position, kind, standard, serial, dueOn, dateKind = 'expires') => ({
      id: item(n),
      entry_id: entry(entryN),
      crew_member_id: memberN ? member(memberN) : null,
      position,
      kind,
      standard,
      serial,
      date_kind: dateKind,
      due_on: dueOn,
    });
    await insertIgnore(queryInterface, 'entry_gear_items', [
      gear(1, 1, 1, 0, 'helmet', 'Maker label KV-2', 'KV2-55120', '2029-05-31'),
      gear(2, 1, 1, 1, 'life_jacket', 'ISO 12402-5', 'LJ-77031', '2028-10-31'),
      gear(3, 1, 2, 10, 'helmet', 'Maker label KV-2', 'KV2-55348', '2029-05-31'),
      gear(4, 1, 2, 11, 'life_jacket', 'ISO 12402-5', 'LJ-77032', '2028-10-31'),
      gear(5, 1, null, 1000, 'fire_extinguisher', 'EN 3-7', 'FX-3091', '2027-06-30', 'service_due'),
      gear(6, 1, null, 1001, 'first_aid_kit', 'Club kit list 2026', 'FA-118', '2028-01-31'),
      // #13's driver: a helmet past its date before the meeting starts.
      gear(7, 2, 3, 0, 'helmet', 'Maker label KV-1', 'KV1-20931', '2027-02-28'),
      gear(8, 2, 3, 1, 'life_jacket', 'ISO 12402-5', 'LJ-60114', '2028-03-31'),
      gear(9, 2, 4, 10, 'helmet', 'Maker label KV-2', 'KV2-51007', '2029-01-31'),
      gear(10, 2, 4, 11, 'life_jacket', 'ISO 12402-5', 'LJ-60115', '2028-03-31'),
      gear(11, 2, null, 1000, 'fire_extinguisher', 'EN 3-7', 'FX-2877', '2027-08-31', 'service_due'),
      gear(12, 3, 5, 0, 'helmet', 'Maker label KV-2', 'KV2-58802', '2030-02-28'),
      gear(13, 3, 5, 1, 'life_jacket', 'ISO 12402-5', 'LJ-81220', '2028-12-31'),
      // Harnesses (every demo class asks for one), #13's first-aid kit and #16's boat gear.
      gear(14, 1, 1, 2, 'harness', 'Maker spec HR-4', 'HR4-1093', '2028-06-30'),
      gear(15, 1, 2, 12, 'harness', 'Maker spec HR-4', 'HR4-1094', '2028-06-30'),
      gear(16, 2, 3, 2, 'harness', 'Maker spec HR-4', 'HR4-0871', '2028-02-29'),
      gear(17, 2, 4, 12, 'harness', 'Maker spec HR-4', 'HR4-0872', '2028-02-29'),
      gear(18, 2, null, 1001, 'first_aid_kit', 'Club kit list 2026', 'FA-121', '2028-01-31'),
      gear(19, 3, 5, 2, 'harness', 'Maker spec HR-4', 'HR4-1320', '2029-03-31'),
      gear(20, 3, null, 1000, 'fire_extinguisher', 'EN 3-7', 'FX-3310', '2027-07-31', 'service_due'),
      gear(21, 3, null, 1001, 'first_aid_kit', 'Club kit list 2026', 'FA-130', '2028-01-31'),
    ]);
  },
  async down(queryInterface) {
    await queryInterface.bulkDelete('entry_gear_items', { entry_id: [entry(1), entry(2), entry(3)] });
    await queryInterface.bulkDelete('entry_crew_members', { entry_id: [entry(1), entry(2), entry(3)] });
    await queryInterface.bulkDelete('crew_requirements', { event_id: ids.meeting });
  },
};
