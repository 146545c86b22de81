'use strict';
// Demo scenario (invented): what identifies each instrument on the Kelda Reach meeting's list, a
// calibration certificate for each from invented laboratories, and one instrument (dock kit B) whose
// certificate is past its due date, so the dock shows it refused with the instrument to use instead.
// Dates are set relative to the day the demo is seeded. The demo certificates carry no file (a real
// one is added with its PDF on the instruments screen). Fixed ids: seeding twice changes nothing.
const { ids, insertIgnore } = require('./20261201000100-demo-people-and-meeting.js');

const inst = (n) => `0b0e0000-0000-4000-8501-${String(n).padStart(12, '0')}`;
const cert = (n) => `0b0e0000-0000-4000-8610-${String(n).padStart(12, '0')}`;
const day = (offsetDays) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);

const IDENTITY = [
  {
    id: inst(1),
    instrument_type: 'caliper',
    serial: 'TW-DC-150-0117',
    range_min: 0,
    range_max: 150,
    material: 'steel',
  },
  {
    id: inst(2),
    instrument_type: 'caliper',
    serial: 'TW-DC-200-0342',
    range_min: 0,
    range_max: 200,
    material: 'steel',
  },
  {
    id: inst(3),
    instrument_type: 'bore_gauge',
    serial: 'TW-BG-160-0008',
    range_min: 50,
    range_max: 160,
    material: 'steel',
  },
  { id: inst(4), instrument_type: 'scale', serial: 'TW-PS-1500-0021', range_min: 0, range_max: 1500, material: null },
];

module.exports = {
  async up(queryInterface) {
    for (const i of IDENTITY) {
      await queryInterface.sequelize.query(
        `update instruments set instrument_type = :instrument_type, serial = :serial, range_min = :range_min, range_max = :range_max, material = :material
          where id = :id and instrument_type is null`,
        { replacements: i },
      );
    }
    const common = {
      added_by_id: ids.chief,
      coverage_factor: 2,
      object_key: null,
      content_type: null,
      size_bytes: null,
      sha256: null,
    };
    await insertIgnore(queryInterface, 'calibration_certificates', [
      {
        id: cert(1),
        instrument_id: inst(1),
        number: 'BML-24-0117',
        laboratory: 'Brackenmoor Length Laboratory',
        calibrated_on: day(-60),
        due_on: day(305),
        expanded_uncertainty: 0.02,
        ...common,
      },
      // Dock kit B: its certificate ran out a week ago, so the dock refuses it and names kit A or the bore gauge.
      {
        id: cert(2),
        instrument_id: inst(2),
        number: 'BML-23-0342',
        laboratory: 'Brackenmoor Length Laboratory',
        calibrated_on: day(-372),
        due_on: day(-7),
        expanded_uncertainty: 0.02,
        ...common,
      },
      {
        id: cert(3),
        instrument_id: inst(3),
        number: 'HGC-7781',
        laboratory: 'Halvard Gauge Calibration',
        calibrated_on: day(-30),
        due_on: day(335),
        expanded_uncertainty: 0.003,
        ...common,
      },
      {
        id: cert(4),
        instrument_id: inst(4),
        number: 'TWM-W-2026-21',
        laboratory: 'Tarn Valley Weighing Services',
        calibrated_on: day(-45),
        due_on: day(140),
        expanded_uncertainty: 1,
        ...common,
      },
    ]);
  },
  async down(queryInterface) {
    // Certificates are append-only: the demo's are removed with the triggers' consent only by dropping the demo database.
    await queryInterface.sequelize.query(
      `update instruments set instrument_type = null, serial = null, range_min = null, range_max = null, material = null where event_id = :meeting`,
      { replacements: { meeting: ids.meeting } },
    );
  },
};
