'use strict';
// Demo scenario (invented): River Runner publishes version 2 of its rules with two measured items of its
// own, engine capacity from bore and stroke (a four-cylinder cap) and fixed ballast, so the dock shows
// them. Everything else is version 1's. In force from the moment the demo is seeded, so records seeded
// earlier keep the version they were decided under. Seeding twice changes nothing.
const { ids } = require('./20261201000100-demo-people-and-meeting.js');

const RR = '0b0e0000-0000-4000-8101-000000000003';

const MEASURED_ITEMS = [
  {
    key: 'engine_capacity',
    label: 'Engine capacity',
    unit: 'cm³',
    minimum: null,
    maximum: 2000,
    readings: 1,
    instrumentTypes: ['caliper', 'bore_gauge'],
    decisionRule: null,
    defaultUncertainty: 5,
    note: 'bore measured on cylinder 1',
    formula: { kind: 'engine_capacity', cylinders: 4 },
  },
  {
    key: 'ballast',
    label: 'Fixed ballast',
    unit: 'kg',
    minimum: 15,
    maximum: null,
    readings: 2,
    instrumentTypes: ['scale'],
    decisionRule: null,
    defaultUncertainty: 0.5,
    note: 'removed and weighed on its own',
    formula: { kind: 'direct' },
  },
];

module.exports = {
  async up(queryInterface) {
    const q = queryInterface.sequelize;
    const [done] = await q.query('select 1 from class_rule_versions where class_id = :cid and version = 2', {
      replacements: { cid: RR },
    });
    if (done.length) return;
    const [v1] = await q.query(
      "select rules from class_rule_versions where class_id = :cid and version = 1 and status = 'published'",
      { replacements: { cid: RR } },
    );
    if (!v1.length) return;
    // A draft of the class (if the organiser opened one) would clash with the one-draft index only if it were v2.
    const [draft] = await q.query("select 1 from class_rule_versions where class_id = :cid and status = 'draft'", {
      replacements: { cid: RR },
    });
    if (draft.length) return;
    const now = new Date().toISOString();
    await q.query(
      `insert into class_rule_versions (class_id, version, status, rules, change_note, effective_from, published_at, published_by_id)
       values (:cid, 2, 'published', :rules::jsonb, :note, :eff, :eff, :by)`,
      {
        replacements: {
          cid: RR,
          rules: JSON.stringify({ ...v1[0].rules, measuredItems: MEASURED_ITEMS }),
          note: 'Engine capacity (bore and stroke) and fixed ballast added as measured items',
          eff: now,
          by: ids.organiser,
        },
      },
    );
  },
  async down() {
    // Published rule versions are frozen by their trigger: dropping the demo database removes them.
  },
};
