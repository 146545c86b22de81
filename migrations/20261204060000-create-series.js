'use strict';
// Series (issue 22, item 3): a season's championship across meetings of one or more organisations.
// - series, series_organisations: the organisations whose meetings may be rounds.
// - series_officials: people with a role scoped to one series (series_secretary runs it, series_steward reads
//   its penalties and parity history); an appointment may be ended (the row removed).
// - series_classes: a class of the series with its points table (points per place) and dropped rounds.
// - series_rule_versions: the class's rules across the season, append-only, each with its effective date.
// - race_classes.series_class_id: a meeting's class that is a round of a series class.
// - series_bulletins: technical bulletins to every entrant of the class, append-only, numbered, effective dates.
// - series_race_numbers: season race numbers, unique per series class (one number per boat).
// - penalty_catalogue_items.series_id gets its foreign key.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      const appendOnly = (table) =>
        q(`create trigger ${table}_append_only before update or delete on ${table}
             for each row execute function boreline_append_only();`);
      await q(`create table series (
        id uuid primary key default gen_random_uuid(),
        name text not null check (char_length(btrim(name)) between 3 and 120),
        season integer not null check (season between 2000 and 2200),
        created_by_id uuid not null references users (id) on delete restrict,
        created_at timestamptz not null default now())`);
      await q(`create unique index series_name_season on series (lower(name), season)`);
      await q(`create table series_organisations (
        series_id uuid not null references series (id) on delete cascade,
        organisation_id uuid not null references organisations (id) on delete restrict,
        primary key (series_id, organisation_id))`);
      await q(`create table series_officials (
        id uuid primary key default gen_random_uuid(),
        series_id uuid not null references series (id) on delete cascade,
        user_id uuid not null references users (id) on delete cascade,
        role text not null check (role in ('series_secretary', 'series_steward')),
        appointed_by_id uuid references users (id) on delete set null,
        appointed_at timestamptz not null default now())`);
      await q(`create unique index series_officials_one on series_officials (series_id, user_id, role)`);
      await q(`create index series_officials_user on series_officials (user_id)`);
      await q(`create table series_classes (
        id uuid primary key default gen_random_uuid(),
        series_id uuid not null references series (id) on delete cascade,
        code varchar(12) not null,
        name text not null check (char_length(btrim(name)) between 2 and 120),
        points_by_position jsonb not null check (jsonb_typeof(points_by_position) = 'array'),
        dropped_rounds integer not null default 0 check (dropped_rounds between 0 and 20),
        created_at timestamptz not null default now())`);
      await q(`create unique index series_classes_code on series_classes (series_id, lower(code))`);
      await q(`create table series_rule_versions (
        id uuid primary key default gen_random_uuid(),
        series_class_id uuid not null references series_classes (id) on delete restrict,
        version integer not null check (version >= 1),
        rules jsonb not null,
        change_note text not null default '',
        effective_from date not null,
        published_by_id uuid not null references users (id) on delete restrict,
        published_at timestamptz not null default now())`);
      await q(`create unique index series_rule_versions_number on series_rule_versions (series_class_id, version)`);
      await appendOnly('series_rule_versions');
      await q(`alter table race_classes add column series_class_id uuid references series_classes (id) on delete restrict`);
      await q(`create index race_classes_series_class on race_classes (series_class_id) where series_class_id is not null`);
      await q(`create table series_bulletins (
        id uuid primary key default gen_random_uuid(),
        series_class_id uuid not null references series_classes (id) on delete restrict,
        number integer not null check (number >= 1),
        title text not null check (char_length(btrim(title)) between 3 and 200),
        body text not null check (char_length(btrim(body)) between 10 and 20000),
        effective_from date not null,
        published_by_id uuid not null references users (id) on delete restrict,
        published_at timestamptz not null default now(),
        recipient_count integer not null check (recipient_count >= 0))`);
      await q(`create unique index series_bulletins_number on series_bulletins (series_class_id, number)`);
      await appendOnly('series_bulletins');
      await q(`create table series_race_numbers (
        id uuid primary key default gen_random_uuid(),
        series_class_id uuid not null references series_classes (id) on delete restrict,
        boat_id uuid not null references boats (id) on delete restrict,
        race_number integer not null check (race_number between 1 and 9999),
        assigned_by_id uuid not null references users (id) on delete restrict,
        assigned_at timestamptz not null default now())`);
      await q(`create unique index series_race_numbers_number on series_race_numbers (series_class_id, race_number)`);
      await q(`create unique index series_race_numbers_boat on series_race_numbers (series_class_id, boat_id)`);
      await q(`alter table penalty_catalogue_items add constraint penalty_catalogue_series_fk
        foreign key (series_id) references series (id) on delete restrict`);
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`alter table penalty_catalogue_items drop constraint penalty_catalogue_series_fk`);
      await q(`alter table race_classes drop column series_class_id`);
      for (const t of ['series_race_numbers', 'series_bulletins', 'series_rule_versions', 'series_classes', 'series_officials', 'series_organisations', 'series'])
        await q(`drop table ${t}`);
    });
  },
};
