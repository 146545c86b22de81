'use strict';
// Demo scenario (invented), components with identity: engines, jet pumps and impellers with serial
// numbers on the first six demo boats, registered with each boat's first declaration (version 1 names
// them). Makers, models and serials are invented. Fixed ids and "on conflict do nothing" make seeding
// twice harmless.
const { ids, insertIgnore } = require('./20261201000100-demo-people-and-meeting.js');

const uuid = (group, n) => `0b0e0000-0000-4000-8${group}-${String(n).padStart(12, '0')}`;
const boatId = (i) => uuid('301', i + 1);
// The owners as the boats seeder assigns them: the demo entrant has boat 1, invented entrants the rest.
const ownerOf = (i) => (i === 0 ? ids.entrant : uuid('201', (i % 24) + 1));

const ENGINES = [
  ['Tarnmoor Engines', 'TM 6.2 V8'],
  ['Brackwell Power', 'BW-8 Sprint'],
];
const PUMPS = [
  ['Corrie Jetworks', 'CJ-212 two-stage'],
  ['Selby Hydro', 'SH Axial 3'],
];
const IMPELLERS = [
  ['Holm Blades', 'HB stainless 3-blade'],
  ['Corrie Jetworks', 'CJ-212 matched set'],
];

module.exports = {
  async up(queryInterface) {
    const q = queryInterface.sequelize;
    const components = [];
    for (let i = 0; i < 6; i++) {
      const add = (kind, [maker, model], serial, trimCode = '') =>
        components.push({
          id: uuid('311', components.length + 1),
          kind,
          maker,
          model,
          serial_number: serial,
          trim_code: trimCode,
          notes: '',
          boat_id: boatId(i),
          created_by_id: ownerOf(i),
        });
      add('engine', ENGINES[i % 2], `${i % 2 ? 'BW' : 'TM'}-${48120 + i * 37}`);
      if (i % 2 === 0) add('pump', PUMPS[(i / 2) % 2], `P${2031 + i}-K`);
      add('impeller', IMPELLERS[i % 2], `IMP-${7700 + i * 11}`, ['T3', 'T4', 'C2'][i % 3]);
    }
    await insertIgnore(queryInterface, 'boat_components', components);
    await insertIgnore(
      queryInterface,
      'component_events',
      components.map((c, n) => ({
        id: uuid('312', n + 1),
        component_id: c.id,
        action: 'registered',
        boat_id: c.boat_id,
        details: '{}',
        recorded_by_id: c.created_by_id,
      })),
    );
    // Version 1 of each boat's declaration names the components it was registered with.
    const [versions] = await q.query(
      `select id, boat_id from boat_declaration_versions where version = 1 and boat_id in (:boats)`,
      { replacements: { boats: [...new Set(components.map((c) => c.boat_id))] } },
    );
    const v1 = new Map(versions.map((v) => [v.boat_id, v.id]));
    await insertIgnore(
      queryInterface,
      'declaration_version_components',
      components
        .filter((c) => v1.has(c.boat_id))
        .map((c) => ({
          declaration_version_id: v1.get(c.boat_id),
          component_id: c.id,
          kind: c.kind,
          maker: c.maker,
          model: c.model,
          serial_number: c.serial_number,
          trim_code: c.trim_code,
        })),
    );
  },
  async down() {
    // Components, their events and the declarations naming them are append-only: nothing to undo.
  },
};
