'use strict';
// Demo scenario (invented), part two: three classes at the Kelda Reach meeting with different
// rules, about thirty boats from invented entrants with plausible declarations, some paid, some not.
// Fixed ids and "on conflict do nothing" make seeding twice harmless.
const bcrypt = require('bcryptjs');
const { randomBytes } = require('crypto');
const { ids, insertIgnore, DEMO_PASSWORD } = require('./20261201000100-demo-people-and-meeting.js');

const uuid = (group, n) => `0b0e0000-0000-4000-8${group}-${String(n).padStart(12, '0')}`;
const classIds = { SS: uuid('101', 1), GP: uuid('101', 2), RR: uuid('101', 3) };

const baseParity = { pumpEfficiency: 0.9, nozzleLossCoefficient: 0.02, inletLossCoefficient: 0.2, wakeFraction: 0 };
const safety = ['kill_switch', 'helmet', 'life_jacket', 'harness', 'fire_extinguisher', 'tow_point'];
const CLASSES = [
  {
    id: classIds.SS,
    code: 'SS',
    name: 'Sprint Sport',
    description: 'Parity class for naturally aspirated V8s on a capped nozzle.',
    versions: [
      {
        version: 1,
        effective: '2026-11-01T00:00:00Z',
        note: 'Rules for the season',
        rules: {
          nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
          power: { minKw: 180, maxKw: 260, defaultUncertaintyKw: 5 },
          weight: { minKg: 650, includesDriver: true, defaultUncertaintyKg: 1 },
          decisionRule: 'iso14253',
          safetyItems: [...safety, 'roll_cage'],
          parity: { ...baseParity, referenceSpeedsMs: [10, 20, 30] },
        },
      },
    ],
  },
  {
    id: classIds.GP,
    code: 'GP',
    name: 'Group Pro',
    description: 'Open engines within a power cap; nozzle limited.',
    versions: [
      {
        version: 1,
        effective: '2026-11-01T00:00:00Z',
        note: 'Rules for the season',
        rules: {
          nozzle: { maxMm: 110, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
          power: { minKw: null, maxKw: 450, defaultUncertaintyKw: 8 },
          weight: { minKg: 720, includesDriver: true, defaultUncertaintyKg: 1 },
          decisionRule: 'guarded',
          safetyItems: [...safety, 'roll_cage', 'first_aid_kit'],
          parity: { ...baseParity, referenceSpeedsMs: [15, 25, 35] },
        },
      },
      {
        version: 2,
        effective: '2026-11-20T00:00:00Z',
        note: 'Nozzle cap reduced to 108 mm after the parity review',
        rules: {
          nozzle: { maxMm: 108, minMm: null, minReadings: 4, defaultUncertaintyMm: 0.05 },
          power: { minKw: null, maxKw: 450, defaultUncertaintyKw: 8 },
          weight: { minKg: 720, includesDriver: true, defaultUncertaintyKg: 1 },
          decisionRule: 'guarded',
          safetyItems: [...safety, 'roll_cage', 'first_aid_kit'],
          parity: { ...baseParity, referenceSpeedsMs: [15, 25, 35] },
        },
      },
    ],
  },
  {
    id: classIds.RR,
    code: 'RR',
    name: 'River Runner',
    description: 'Entry-level class with a nozzle window and a modest power band.',
    versions: [
      {
        version: 1,
        effective: '2026-11-01T00:00:00Z',
        note: 'Rules for the season',
        rules: {
          nozzle: { maxMm: 95, minMm: 85, minReadings: 3, defaultUncertaintyMm: 0.08 },
          power: { minKw: 150, maxKw: 220, defaultUncertaintyKw: 5 },
          weight: { minKg: 600, includesDriver: false, defaultUncertaintyKg: 1 },
          decisionRule: 'simple',
          safetyItems: safety,
          parity: { ...baseParity, referenceSpeedsMs: [10, 20, 25] },
        },
      },
    ],
  },
];

// A small deterministic generator so the demo declarations are the same on every machine.
function rng(seed) {
  let s = seed >>> 0;
  return () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
}

const FIRST = [
  'Ari',
  'Bex',
  'Corin',
  'Dana',
  'Ezra',
  'Fen',
  'Greer',
  'Hollis',
  'Ivo',
  'Jessa',
  'Kit',
  'Lior',
  'Mika',
  'Nell',
  'Oren',
  'Pia',
  'Quill',
  'Rowan',
  'Sol',
  'Tamsin',
  'Uma',
  'Vesna',
  'Wren',
  'Yara',
];
const LAST = [
  'Ashdown',
  'Brackley',
  'Carrow',
  'Dunmore',
  'Ellery',
  'Fairweather',
  'Gillan',
  'Harrowby',
  'Inchley',
  'Jessop',
  'Kestle',
  'Lowrie',
  'Marrick',
  'Nethercott',
  'Orrin',
  'Pellow',
  'Quarry',
  'Redfern',
  'Stanway',
  'Tolland',
  'Upcott',
  'Varley',
  'Wexcombe',
  'Yelland',
];
const BOAT_A = ['Tussock', 'Shingle', 'Braid', 'Gorge', 'Rapid', 'Eddy', 'Shoal', 'Riffle', 'Cascade', 'Flume'];
const BOAT_B = ['Runner', 'Arrow', 'Kite', 'Hawk', 'Wasp', 'Comet', 'Dart', 'Flint', 'Skua', 'Raven'];
const PUMPS = [
  '3-stage axial, 14 in impeller housing',
  '2-stage mixed flow, cast stainless bowl',
  'single-stage mixed flow, bronze impeller',
];
const ENGINES = [
  'small-block V8, 6.2 L, carburetted',
  'big-block V8, 8.2 L, fuel injected',
  'V8, 5.7 L, marine conversion',
];

function boatFor(i, cls, r) {
  const nozzle = {
    SS: () => 99.2 + r() * 2.9, // a few sit close to the 102.00 cap
    GP: () => 104 + r() * 5.5,
    RR: () => 86 + r() * 8.5,
  }[cls]();
  const power = { SS: () => 190 + r() * 68, GP: () => 330 + r() * 115, RR: () => 155 + r() * 62 }[cls]();
  const weight = { SS: () => 655 + r() * 60, GP: () => 725 + r() * 70, RR: () => 605 + r() * 50 }[cls]();
  return {
    name: `${BOAT_A[i % 10]} ${BOAT_B[(i * 3 + 1) % 10]}`,
    nozzle: Math.round(nozzle * 100) / 100,
    power: Math.round(power),
    weight: Math.round(weight),
    pump: PUMPS[i % 3],
    engine: ENGINES[(i + (cls === 'GP' ? 1 : 0)) % 3],
  };
}

module.exports = {
  async up(queryInterface) {
    const q = queryInterface.sequelize;
    await insertIgnore(
      queryInterface,
      'race_classes',
      CLASSES.map((c) => ({ id: c.id, event_id: ids.meeting, name: c.name, code: c.code, description: c.description })),
    );
    for (const c of CLASSES) {
      for (const v of c.versions) {
        const [rows] = await q.query('select 1 from class_rule_versions where class_id = :cid and version = :v', {
          replacements: { cid: c.id, v: v.version },
        });
        if (rows.length) continue;
        await q.query(
          `insert into class_rule_versions (class_id, version, status, rules, change_note, effective_from, published_at, published_by_id)
           values (:cid, :v, 'published', :rules::jsonb, :note, :eff, :eff, :by)`,
          {
            replacements: {
              cid: c.id,
              v: v.version,
              rules: JSON.stringify(v.rules),
              note: v.note,
              eff: v.effective,
              by: ids.organiser,
            },
          },
        );
      }
    }
    await q.query(
      `update events set entry_fee_minor = 15000, protest_fee_minor = 5000, currency = 'NZD', water_kind = 'fresh',
                   water_temperature_c = 14, protest_window_minutes = 30 where id = :id and entry_fee_minor = 0`,
      { replacements: { id: ids.meeting } },
    );

    const hash = bcrypt.hashSync(DEMO_PASSWORD, 10);
    const people = [];
    for (let i = 0; i < 24; i++) {
      people.push({
        id: uuid('201', i + 1),
        name: `${FIRST[i]} ${LAST[(i * 7) % 24]}`,
        email: `${FIRST[i].toLowerCase()}.${LAST[(i * 7) % 24].toLowerCase()}@entrants.example`,
        password_hash: hash,
        email_verified: new Date(),
        is_admin: false,
      });
    }
    await insertIgnore(queryInterface, 'users', people);

    const r = rng(20270313);
    const boats = [];
    const entries = [];
    const order = ['SS', 'GP', 'RR'];
    for (let i = 0; i < 30; i++) {
      const cls = order[i % 3];
      const owner = i === 0 ? ids.entrant : people[i % 24].id;
      const b = boatFor(i, cls, r);
      const boatId = uuid('301', i + 1);
      boats.push({
        id: boatId,
        owner_id: owner,
        name: b.name,
        hull_number: `${cls}-${String(i + 1).padStart(2, '0')}`,
        hull_description: 'Aluminium sprint hull, 4.3 m',
        pump_description: b.pump,
        impeller_description: 'Stainless, as supplied',
        declared_nozzle_mm: b.nozzle,
        declared_nozzle_tolerance_mm: 0.1,
        engine_description: b.engine,
        declared_power_kw: b.power,
        power_evidence: i % 4 === 0 ? 'maker_rating' : 'dyno_sheet',
        displacement_l: cls === 'GP' ? 8.2 : 6.2,
        declared_weight_kg: b.weight,
      });
      const paid = i % 5 !== 3; // most paid; a few still awaiting payment
      entries.push({
        id: uuid('401', i + 1),
        event_id: ids.meeting,
        class_id: classIds[cls],
        boat_id: boatId,
        entrant_id: owner,
        race_number: 10 + i * 3,
        status: paid ? 'entered' : 'awaiting_payment',
        fee_minor: 15000,
        currency: 'NZD',
        paid_at: paid ? new Date(Date.UTC(2026, 10, 5 + (i % 20))) : null,
      });
    }
    await insertIgnore(queryInterface, 'boats', boats);
    await insertIgnore(queryInterface, 'entries', entries);
    // Tags carry random tokens; the partial unique index keeps one current tag per boat.
    await insertIgnore(
      queryInterface,
      'boat_tags',
      boats.map((b) => ({ boat_id: b.id, token: randomBytes(18).toString('base64url') })),
    );
  },
  async down(queryInterface) {
    await queryInterface.bulkDelete('entries', { event_id: ids.meeting });
  },
};
