'use strict';
// Crew and fuel masses an entrant declares for one entry (issue 20, item 2): the predicted run adds them to the
// weight measured at inspection instead of the assumed 160 kg crew and 25 kg fuel. Append-only, like run times:
// each declaration is a new row with who made it and when; the entry's current declaration is its newest row.
// A value left null is not declared (the assumption is used for it). The bounds are sanity limits, not class
// rules (common practice, no source): a crew of one or two between 30 and 400 kg, at most 200 kg of fuel.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`create table entry_mass_declarations (
                 id uuid primary key default gen_random_uuid(),
                 entry_id uuid not null references entries(id) on delete restrict,
                 crew_kg double precision
                   constraint entry_mass_declarations_crew_check check (crew_kg is null or (crew_kg >= 30 and crew_kg <= 400)),
                 fuel_kg double precision
                   constraint entry_mass_declarations_fuel_check check (fuel_kg is null or (fuel_kg >= 0 and fuel_kg <= 200)),
                 declared_by_id uuid not null references users(id) on delete restrict,
                 declared_at timestamptz not null default clock_timestamp())`);
      await q(`create index entry_mass_declarations_entry on entry_mass_declarations (entry_id, declared_at desc)`);
      await q(`create trigger entry_mass_declarations_append_only before update or delete on entry_mass_declarations
                 for each row execute function boreline_append_only()`);
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.query('drop table entry_mass_declarations');
  },
};
