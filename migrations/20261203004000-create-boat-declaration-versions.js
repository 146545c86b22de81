'use strict';
// A boat's declaration becomes append-only versions (issue 15, item 1): an edit is version N+1 with
// who and when, never a change to an earlier version. Entries pin the version they were entered
// with and inspections the version they checked; both are filled by a trigger at insert when the
// writer does not name one (the latest version of the boat then), so every path (API, seed, SQL)
// pins something. The boats row stays as the latest version's copy for the screens that read it.
// Each existing boat gets version 1 from its current row; existing entries and inspections pin it.
// Inspections are append-only: this migration disables that trigger inside its own transaction to
// fill the new column (as 20261203003000 does), and enables it again before committing.
/**
 * Version 1, from the boat's row as it stands (by its owner, at its last change), for every boat
 * that has no version yet: all of them when the migration runs. Exported so a test can run it.
 */
async function addFirstVersions(sequelize, { transaction, boatIds } = {}) {
  const [rows] = await sequelize.query(
    `insert into boat_declaration_versions (boat_id, version, hull_description, pump_description, impeller_description,
       declared_nozzle_mm, declared_nozzle_tolerance_mm, engine_description, declared_power_kw, power_evidence,
       displacement_l, declared_weight_kg, created_by_id, created_at)
     select b.id, 1, b.hull_description, b.pump_description, b.impeller_description, b.declared_nozzle_mm, b.declared_nozzle_tolerance_mm,
            b.engine_description, b.declared_power_kw, b.power_evidence, b.displacement_l, b.declared_weight_kg, b.owner_id, b.updated_at
       from boats b
      where not exists (select 1 from boat_declaration_versions d where d.boat_id = b.id)
        ${boatIds ? 'and b.id in (:boatIds)' : ''}
     returning boat_id`,
    { transaction, replacements: { boatIds: boatIds ?? [] } },
  );
  return rows.length;
}

/** @type {import('sequelize-cli').Migration} */
const migration = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`
        create table boat_declaration_versions (
          id uuid primary key default gen_random_uuid(),
          boat_id uuid not null references boats(id) on delete restrict,
          version integer not null check (version >= 1),
          hull_description text not null default '',
          pump_description text not null default '',
          impeller_description text not null default '',
          declared_nozzle_mm double precision not null,
          declared_nozzle_tolerance_mm double precision not null,
          engine_description text not null default '',
          declared_power_kw double precision not null,
          power_evidence varchar(255) not null,
          displacement_l double precision,
          declared_weight_kg double precision,
          created_by_id uuid not null references users(id) on delete restrict,
          created_at timestamptz not null default now(),
          unique (boat_id, version)
        )`);
      await q(`create trigger boat_declaration_versions_append_only before update or delete on boat_declaration_versions
                 for each row execute function boreline_append_only()`);
      // Version 1 of every boat from its row as it stands, by its owner, at its last change.
      await addFirstVersions(queryInterface.sequelize, { transaction });
      // A boat inserted by any path gets its version 1 at once (the app's create and the seeds alike).
      await q(`create function boreline_boat_first_version() returns trigger language plpgsql as $$
               begin
                 insert into boat_declaration_versions (boat_id, version, hull_description, pump_description, impeller_description,
                   declared_nozzle_mm, declared_nozzle_tolerance_mm, engine_description, declared_power_kw, power_evidence,
                   displacement_l, declared_weight_kg, created_by_id, created_at)
                 values (new.id, 1, new.hull_description, new.pump_description, new.impeller_description, new.declared_nozzle_mm,
                   new.declared_nozzle_tolerance_mm, new.engine_description, new.declared_power_kw, new.power_evidence,
                   new.displacement_l, new.declared_weight_kg, new.owner_id, coalesce(new.created_at, now()));
                 return null;
               end $$`);
      await q(`create trigger boats_first_declaration_version after insert on boats
                 for each row execute function boreline_boat_first_version()`);
      // Entries and inspections name the version; left empty, the boat's latest version is pinned.
      await q(`alter table entries add column declaration_version_id uuid references boat_declaration_versions(id) on delete restrict`);
      await q(`alter table inspections add column declaration_version_id uuid references boat_declaration_versions(id) on delete restrict`);
      await q(`alter table reinspections add column declaration_version_id uuid references boat_declaration_versions(id) on delete restrict`);
      await q(`update entries e set declaration_version_id = d.id from boat_declaration_versions d where d.boat_id = e.boat_id and d.version = 1`);
      await q(`alter table inspections disable trigger inspections_append_only`);
      await q(`update inspections i set declaration_version_id = d.id from boat_declaration_versions d where d.boat_id = i.boat_id and d.version = 1`);
      await q(`alter table inspections enable trigger inspections_append_only`);
      await q(`create function boreline_pin_declaration_version() returns trigger language plpgsql as $$
               begin
                 if new.declaration_version_id is null then
                   select d.id into new.declaration_version_id from boat_declaration_versions d
                    where d.boat_id = new.boat_id order by d.version desc limit 1;
                 end if;
                 return new;
               end $$`);
      for (const t of ['entries', 'inspections']) {
        await q(`create trigger ${t}_pin_declaration_version before insert on ${t}
                   for each row execute function boreline_pin_declaration_version()`);
      }
      await q(`alter table entries alter column declaration_version_id set not null`);
      await q(`alter table inspections alter column declaration_version_id set not null`);
      await q(`create index inspections_declaration_version_id on inspections (declaration_version_id)`);
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      for (const t of ['entries', 'inspections']) await q(`drop trigger ${t}_pin_declaration_version on ${t}`);
      await q('drop function boreline_pin_declaration_version()');
      await q(`alter table inspections disable trigger inspections_append_only`);
      for (const t of ['reinspections', 'inspections', 'entries']) await q(`alter table ${t} drop column declaration_version_id`);
      await q(`alter table inspections enable trigger inspections_append_only`);
      await q('drop trigger boats_first_declaration_version on boats');
      await q('drop function boreline_boat_first_version()');
      await q('drop table boat_declaration_versions');
    });
  },
};

// The backfill is exported as well, so a test can run it on boats of its own through the real database.
module.exports = { ...migration, addFirstVersions };
