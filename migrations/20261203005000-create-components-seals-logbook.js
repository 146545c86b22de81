'use strict';
// The record follows the boat (issue 15, items 3 to 5): components with identity, a seal register and
// a boat logbook. Everything that tells what happened is append-only (boreline_append_only from
// migration 500); the only rows that change are a component's current state (which boat, trim code,
// notes), whose every change is also an append-only component event.
//
// - boat_components: an engine, pump or impeller with maker, model and serial; boat_id is where it is now.
//   Its kind and serial never change, and it is never deleted (trigger).
// - component_events: registered / fitted to a boat / taken off a boat / edited, with who and when.
// - declaration_version_components: the components a declaration version names (append-only with it).
// - seal_batches and seals: numbered seals issued to a meeting; seal_events: applied (to a component,
//   with position and an optional photo), found intact / broken / missing, removed (with a reason).
// - boat_log_notes: officials' dated notes on a boat (damage, repairs, anything else).

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`
        create table boat_components (
          id uuid primary key default gen_random_uuid(),
          kind varchar(16) not null check (kind in ('engine', 'pump', 'impeller')),
          maker text not null default '',
          model text not null default '',
          serial_number text not null check (length(trim(serial_number)) between 1 and 80),
          trim_code text not null default '',
          notes text not null default '',
          boat_id uuid references boats(id) on delete restrict,
          created_by_id uuid not null references users(id) on delete restrict,
          created_at timestamptz not null default now(),
          updated_at timestamptz not null default now()
        )`);
      await q(`create unique index boat_components_identity on boat_components (kind, lower(maker), lower(serial_number))`);
      await q(`create index boat_components_serial on boat_components (lower(serial_number))`);
      await q(`create index boat_components_boat on boat_components (boat_id)`);
      await q(`create function boreline_component_identity() returns trigger language plpgsql as $$
               begin
                 if tg_op = 'DELETE' then
                   raise exception 'boat components are never deleted (%)', old.id using errcode = 'P0001';
                 end if;
                 if new.kind <> old.kind or new.serial_number <> old.serial_number or new.created_by_id <> old.created_by_id
                    or new.created_at <> old.created_at then
                   raise exception 'a component''s kind, serial number and creation are fixed (%)', old.id using errcode = 'P0001';
                 end if;
                 return new;
               end $$`);
      await q(`create trigger boat_components_identity before update or delete on boat_components
                 for each row execute function boreline_component_identity()`);

      await q(`
        create table component_events (
          id uuid primary key default gen_random_uuid(),
          component_id uuid not null references boat_components(id) on delete restrict,
          action varchar(16) not null check (action in ('registered', 'fitted', 'removed', 'edited')),
          boat_id uuid references boats(id) on delete restrict,
          details jsonb not null default '{}'::jsonb,
          recorded_by_id uuid not null references users(id) on delete restrict,
          created_at timestamptz not null default now()
        )`);
      await q(`create index component_events_component on component_events (component_id, created_at)`);
      await q(`create index component_events_boat on component_events (boat_id)`);

      await q(`
        create table declaration_version_components (
          declaration_version_id uuid not null references boat_declaration_versions(id) on delete restrict,
          component_id uuid not null references boat_components(id) on delete restrict,
          primary key (declaration_version_id, component_id)
        )`);
      await q(`create index declaration_version_components_component on declaration_version_components (component_id)`);

      await q(`
        create table seal_batches (
          id uuid primary key default gen_random_uuid(),
          event_id uuid not null references events(id) on delete restrict,
          prefix varchar(12) not null default '',
          first_number integer not null check (first_number >= 0),
          last_number integer not null,
          note text not null default '',
          issued_by_id uuid not null references users(id) on delete restrict,
          created_at timestamptz not null default now(),
          check (last_number >= first_number and last_number - first_number < 1000)
        )`);
      await q(`create index seal_batches_event on seal_batches (event_id)`);
      // batch_id is null for a seal carried over from a free-text record written before the register.
      await q(`
        create table seals (
          id uuid primary key default gen_random_uuid(),
          batch_id uuid references seal_batches(id) on delete restrict,
          number varchar(40) not null,
          created_at timestamptz not null default now()
        )`);
      await q(`create unique index seals_number on seals (upper(number))`);
      await q(`create index seals_batch on seals (batch_id)`);
      await q(`
        create table seal_events (
          id uuid primary key default gen_random_uuid(),
          seal_id uuid not null references seals(id) on delete restrict,
          action varchar(16) not null check (action in ('applied', 'intact', 'broken', 'missing', 'removed')),
          component_id uuid references boat_components(id) on delete restrict,
          boat_id uuid references boats(id) on delete restrict,
          event_id uuid references events(id) on delete restrict,
          inspection_id uuid references inspections(id) on delete restrict,
          position text not null default '',
          photo_id uuid references inspection_photos(id) on delete restrict,
          reason text not null default '',
          recorded_by_id uuid not null references users(id) on delete restrict,
          created_at timestamptz not null default now()
        )`);
      await q(`create index seal_events_seal on seal_events (seal_id, created_at)`);
      await q(`create index seal_events_component on seal_events (component_id)`);
      await q(`create index seal_events_boat on seal_events (boat_id)`);
      await q(`create index seal_events_inspection on seal_events (inspection_id)`);

      await q(`
        create table boat_log_notes (
          id uuid primary key default gen_random_uuid(),
          boat_id uuid not null references boats(id) on delete restrict,
          event_id uuid not null references events(id) on delete restrict,
          category varchar(16) not null check (category in ('damage', 'repair', 'observation')),
          body text not null check (length(trim(body)) between 1 and 4000),
          noted_on date not null,
          author_id uuid not null references users(id) on delete restrict,
          created_at timestamptz not null default now()
        )`);
      await q(`create index boat_log_notes_boat on boat_log_notes (boat_id, noted_on)`);

      for (const t of ['component_events', 'declaration_version_components', 'seal_batches', 'seals', 'seal_events', 'boat_log_notes']) {
        await q(`create trigger ${t}_append_only before update or delete on ${t} for each row execute function boreline_append_only()`);
      }
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      for (const t of ['boat_log_notes', 'seal_events', 'seals', 'seal_batches', 'declaration_version_components', 'component_events', 'boat_components']) {
        await q(`drop table ${t}`);
      }
      await q('drop function boreline_component_identity()');
    });
  },
};
