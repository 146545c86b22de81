'use strict';
// A record that proves it was not altered (issue 24): a hash chain per meeting over the append-only
// records, signed checkpoints and the meetings' public keys.
// - chain_queue: filled by an AFTER INSERT trigger on every chained table (no write path can forget it),
//   drained by the linker (lib/server/chain/link-chain.ts), which takes one advisory lock per chain, so the
//   record path never waits on a chain lock.
// - chain_links: one row per chained record, seq 1, 2, … per chain; unique (chain_key, seq) and unique
//   (chain_key, prev_hash) so there is never a fork. Append-only.
// - chain_keys: each chain's Ed25519 public key (SPKI DER) and fingerprint; the private key lives outside
//   the database (BORELINE_KEY_DIR). chain_checkpoints: signed chain heads. Both append-only.
// A chain is a meeting (chain_key = the event's id) or 'site' for records of no single meeting: boat
// declaration versions (a boat enters several meetings; each meeting's inspection pins its version id, so
// the meeting's chain binds the version, and the site chain its content) and audit rows without a meeting.
// How each table finds its meeting: event_id; or a column naming a row of a table that has event_id.
const CHAINED = [
  // [table, how to find the meeting, order for rows that exist already]
  ['inspections', 'event', 'received_at, id'],
  ['inspection_photos', 'inspection_id:inspections', 'created_at, id'],
  ['boat_declaration_versions', 'site', 'created_at, id'],
  ['seal_events', 'event', 'created_at, id'],
  ['provisional_results', 'event', 'published_at, id'],
  ['parity_reports', 'event', 'published_at, id'],
  ['protest_evidence', 'protest_id:protests', 'created_at, id'],
  ['technical_reports', 'event', 'created_at, id'],
  ['penalties', 'event', 'decided_at, id'],
  ['start_decisions', 'event', 'decided_at, id'],
  ['custody_items', 'event', 'taken_at, id'],
  ['custody_releases', 'item_id:custody_items', 'released_at, id'],
  ['audit_events', 'event', 'id'],
];

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  CHAINED,
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`create table chain_queue (
        id bigserial primary key,
        chain_key text not null,
        table_name text not null,
        row_id text not null,
        queued_at timestamptz not null default clock_timestamp())`);
      await q(`create index chain_queue_chain on chain_queue (chain_key, id)`);
      await q(`create table chain_links (
        chain_key text not null,
        seq bigint not null check (seq >= 1),
        table_name text not null,
        row_id text not null,
        row_hash char(64) not null,
        prev_hash char(64) not null,
        link_hash char(64) not null,
        linked_at timestamptz not null default clock_timestamp(),
        primary key (chain_key, seq),
        unique (chain_key, prev_hash),
        unique (chain_key, table_name, row_id))`);
      await q(`create table chain_keys (
        chain_key text primary key,
        public_key_spki bytea not null,
        fingerprint char(64) not null unique,
        created_at timestamptz not null default now())`);
      await q(`create table chain_checkpoints (
        id bigserial primary key,
        chain_key text not null,
        count bigint not null check (count >= 0),
        head char(64) not null,
        reason text not null,
        signed_at timestamptz not null,
        key_fingerprint char(64) not null references chain_keys (fingerprint),
        signature text not null)`);
      await q(`create index chain_checkpoints_chain on chain_checkpoints (chain_key, id)`);
      for (const t of ['chain_links', 'chain_keys', 'chain_checkpoints'])
        await q(`create trigger ${t}_append_only before update or delete on ${t} for each row execute function boreline_append_only()`);

      // The chain a row belongs to: kind 'event' (its event_id, else the site chain), 'site', or
      // 'column:table' (the event_id of the row that column names).
      await q(`create function boreline_chain_of(kind text, j jsonb) returns text language plpgsql stable as $$
        declare ev uuid; col text; tbl text;
        begin
          if kind = 'site' then return 'site'; end if;
          if kind = 'event' then return coalesce(j->>'event_id', 'site'); end if;
          col := split_part(kind, ':', 1); tbl := split_part(kind, ':', 2);
          execute format('select event_id from %I where id = $1', tbl) into ev using (j->>col)::uuid;
          return coalesce(ev::text, 'site');
        end $$`);
      await q(`create function boreline_chain_enqueue() returns trigger language plpgsql as $$
        declare j jsonb := to_jsonb(new);
        begin
          insert into chain_queue (chain_key, table_name, row_id)
          values (boreline_chain_of(tg_argv[0], j), tg_table_name, j->>'id');
          return null;
        end $$`);
      for (const [table, kind, order] of CHAINED) {
        await q(`create trigger ${table}_chain after insert on ${table}
                   for each row execute function boreline_chain_enqueue('${kind}')`);
        await q(`insert into chain_queue (chain_key, table_name, row_id)
                 select boreline_chain_of('${kind}', to_jsonb(t)), '${table}', t.id::text from ${table} t order by ${order}`);
      }
      // Rule versions are chained when published (a draft is edited until then; a published one is frozen).
      await q(`create trigger class_rule_versions_chain_insert after insert on class_rule_versions
                 for each row when (new.status = 'published')
                 execute function boreline_chain_enqueue('class_id:race_classes')`);
      await q(`create trigger class_rule_versions_chain_publish after update on class_rule_versions
                 for each row when (new.status = 'published' and old.status is distinct from 'published')
                 execute function boreline_chain_enqueue('class_id:race_classes')`);
      await q(`insert into chain_queue (chain_key, table_name, row_id)
               select boreline_chain_of('class_id:race_classes', to_jsonb(t)), 'class_rule_versions', t.id::text
                 from class_rule_versions t where status = 'published' order by published_at, id`);
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      for (const [table] of CHAINED) await q(`drop trigger ${table}_chain on ${table}`);
      await q('drop trigger class_rule_versions_chain_insert on class_rule_versions');
      await q('drop trigger class_rule_versions_chain_publish on class_rule_versions');
      await q('drop function boreline_chain_enqueue()');
      await q('drop function boreline_chain_of(text, jsonb)');
      for (const t of ['chain_checkpoints', 'chain_keys', 'chain_links', 'chain_queue']) await q(`drop table ${t}`);
    });
  },
};
