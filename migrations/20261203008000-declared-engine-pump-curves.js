'use strict';
// Declared engine and pump data per boat (issue 19, item 3): the engine's power curve, the pump's
// characteristic and the inlet's suction data travel with the boat's declaration as one JSON
// document (models/shapes/boat-performance.ts), so they are versioned, pinned by entries and
// inspections, and flagged after inspection like every other declared figure. The live boats row
// keeps the latest version's copy for the screens.
// The pump catalogue: a meeting's organiser enters a maker's impeller model and trim with its curve
// once for everyone; a declaration that picks one keeps a copy of the curve as it was, and entries are
// append-only (a correction is a new entry), so a catalogue change never rewrites a declaration.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`alter table boats add column declared_performance jsonb`);
      await q(`alter table boat_declaration_versions add column declared_performance jsonb`);
      await q(`create table pump_catalogue_entries (
                 id uuid primary key default gen_random_uuid(),
                 event_id uuid not null references events(id) on delete restrict,
                 maker varchar(80) not null check (length(maker) between 1 and 80),
                 model varchar(80) not null check (length(model) between 1 and 80),
                 trim_code varchar(40) not null default '',
                 impeller_diameter_mm double precision not null check (impeller_diameter_mm > 0 and impeller_diameter_mm <= 2000),
                 curve jsonb not null check (jsonb_typeof(curve) = 'array'),
                 created_by_id uuid not null references users(id) on delete restrict,
                 created_at timestamptz not null default now())`);
      await q(`create index pump_catalogue_entries_event on pump_catalogue_entries (event_id, created_at)`);
      await q(`create trigger pump_catalogue_entries_append_only before update or delete on pump_catalogue_entries
                 for each row execute function boreline_append_only()`);
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`drop table pump_catalogue_entries`);
      await q(`alter table boat_declaration_versions drop column declared_performance`);
      await q(`alter table boats drop column declared_performance`);
    });
  },
};
