'use strict';
// Penalties and appeals (issue 22, items 1 and 2).
// - appeal_body_members: the people of the governing body's appeal body, a role above any single meeting
//   (like the site administrator's flag, but a row per person so appointments can be listed and ended).
// - penalty_catalogue_items: what stewards may impose, per meeting now; series_id is there for the series
//   work (its foreign key comes with the series table), so one catalogue can later serve several meetings.
// - technical_reports: a technical delegate's report to the stewards without a protest.
// - penalties: a stewards' decision imposing one catalogue item on one entry, from an upheld protest or a
//   technical report, or set by the appeal body when it amends a decision. The item's words and amount are
//   copied, so a penalty reads as decided.
// - appeals: notice of appeal against a penalty, its fee (checkout + verified webhook, as protests), the
//   hearing and the appeal body's decision (confirmed, amended, annulled). Changes are in the audit trail.
// - provisional_results: a version may now be written by the stewards or the appeal body (the organiser's
//   latest version with the penalties in force applied), with the amendments beside the rows they touch.
// Catalogue items, reports and penalties are append-only; an annulled penalty stays, its appeal says why.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, INTEGER, TEXT } = Sequelize;
    const id = { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const now = { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
    const ref = (table, allowNull = false) => ({
      type: UUID,
      allowNull,
      references: { model: table, key: 'id' },
      onDelete: 'RESTRICT',
    });
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      const appendOnly = (table) =>
        q(`create trigger ${table}_append_only before update or delete on ${table}
             for each row execute function boreline_append_only();`);

      await queryInterface.createTable(
        'appeal_body_members',
        { id, user_id: { ...ref('users'), onDelete: 'CASCADE' }, appointed_by_id: ref('users', true), appointed_at: now },
        { transaction },
      );
      await q(`create unique index appeal_body_members_user on appeal_body_members (user_id)`);

      await q(`alter table events add column appeal_fee_minor integer not null default 0,
        add constraint events_appeal_fee_check check (appeal_fee_minor between 0 and 10000000)`);

      await queryInterface.createTable(
        'penalty_catalogue_items',
        {
          id,
          event_id: ref('events', true),
          series_id: { type: UUID, allowNull: true },
          code: { type: STRING(16), allowNull: false },
          kind: { type: STRING, allowNull: false },
          amount: { type: INTEGER, allowNull: true },
          label: { type: TEXT, allowNull: false },
          rule_reference: { type: STRING(120), allowNull: false, defaultValue: '' },
          created_by_id: ref('users'),
          created_at: now,
        },
        { transaction },
      );
      await q(`alter table penalty_catalogue_items
        add constraint penalty_catalogue_scope_check check ((event_id is null) <> (series_id is null)),
        add constraint penalty_catalogue_kind_check check (kind in ('time_added', 'places_deducted', 'points_deducted',
          'run_disqualification', 'meeting_disqualification', 'exclusion', 'fine', 'warning')),
        add constraint penalty_catalogue_amount_check check (
          (kind in ('time_added', 'places_deducted', 'points_deducted', 'fine') and amount is not null and amount > 0)
          or (kind not in ('time_added', 'places_deducted', 'points_deducted', 'fine') and amount is null)),
        add constraint penalty_catalogue_label_check check (char_length(btrim(label)) between 3 and 200)`);
      await q(`create unique index penalty_catalogue_event_code on penalty_catalogue_items (event_id, lower(code)) where event_id is not null`);
      await q(`create unique index penalty_catalogue_series_code on penalty_catalogue_items (series_id, lower(code)) where series_id is not null`);
      await appendOnly('penalty_catalogue_items');

      await queryInterface.createTable(
        'technical_reports',
        {
          id,
          event_id: ref('events'),
          entry_id: ref('entries'),
          filed_by_id: ref('users'),
          rule_reference: { type: STRING(120), allowNull: false },
          facts: { type: TEXT, allowNull: false },
          inspection_id: ref('inspections', true),
          created_at: now,
        },
        { transaction },
      );
      await q(`alter table technical_reports add constraint technical_reports_facts_check check (char_length(btrim(facts)) between 3 and 4000)`);
      await q(`create index technical_reports_event on technical_reports (event_id, created_at)`);
      await appendOnly('technical_reports');

      await queryInterface.createTable(
        'penalties',
        {
          id,
          event_id: ref('events'),
          entry_id: ref('entries'),
          catalogue_item_id: ref('penalty_catalogue_items'),
          code: { type: STRING(16), allowNull: false },
          kind: { type: STRING, allowNull: false },
          amount: { type: INTEGER, allowNull: true },
          label: { type: TEXT, allowNull: false },
          run_label: { type: STRING(40), allowNull: true },
          protest_id: ref('protests', true),
          technical_report_id: ref('technical_reports', true),
          appeal_id: { type: UUID, allowNull: true }, // set when the appeal body amends; FK added below
          replaces_penalty_id: ref('penalties', true),
          reason: { type: TEXT, allowNull: false },
          decided_by_id: ref('users'),
          decided_at: now,
        },
        { transaction },
      );
      await q(`alter table penalties
        add constraint penalties_source_check check (num_nonnulls(protest_id, technical_report_id, appeal_id) = 1),
        add constraint penalties_replaces_check check ((appeal_id is null) = (replaces_penalty_id is null)),
        add constraint penalties_run_check check ((kind = 'run_disqualification') = (run_label is not null)),
        add constraint penalties_reason_check check (char_length(btrim(reason)) between 3 and 2000)`);
      await q(`create index penalties_event on penalties (event_id, decided_at)`);
      await q(`create index penalties_entry on penalties (entry_id)`);
      await appendOnly('penalties');

      await queryInterface.createTable(
        'appeals',
        {
          id,
          event_id: ref('events'),
          penalty_id: ref('penalties'),
          lodged_by_id: ref('users'),
          grounds: { type: TEXT, allowNull: false },
          status: { type: STRING, allowNull: false },
          fee_minor: { type: INTEGER, allowNull: false },
          currency: { type: STRING(3), allowNull: false },
          checkout_session_id: { type: STRING, unique: true },
          payment_intent_id: { type: STRING },
          paid_at: { type: DATE },
          refund_id: { type: STRING },
          refunded_at: { type: DATE },
          notice_deadline: { type: DATE, allowNull: false },
          hearing_at: { type: DATE },
          hearing_place: { type: STRING(200) },
          decision_reasons: { type: TEXT },
          decided_at: { type: DATE },
          decided_by_id: ref('users', true),
          created_at: now,
          updated_at: now,
        },
        { transaction },
      );
      await q(`alter table appeals
        add constraint appeals_status_check check (status in ('awaiting_fee', 'lodged', 'hearing_scheduled', 'confirmed', 'amended', 'annulled')),
        add constraint appeals_fee_check check (fee_minor >= 0),
        add constraint appeals_grounds_check check (char_length(btrim(grounds)) between 10 and 4000),
        add constraint appeals_decided_check check ((status in ('confirmed', 'amended', 'annulled')) = (decided_at is not null))`);
      // One appeal per person per penalty.
      await q(`create unique index appeals_one_per_party on appeals (penalty_id, lodged_by_id)`);
      await q(`create index appeals_event on appeals (event_id, status)`);
      await q(`alter table penalties add constraint penalties_appeal_fk foreign key (appeal_id) references appeals (id) on delete restrict`);
      // At most one penalty replaces another (the appeal body's amendment).
      await q(`create unique index penalties_one_replacement on penalties (replaces_penalty_id) where replaces_penalty_id is not null`);

      // Results versions written by the stewards or the appeal body, with their amendments.
      await q(`alter table provisional_results add column amendments jsonb not null default '[]'::jsonb`);
      await q(`alter table provisional_results drop constraint provisional_results_source_check,
        add constraint provisional_results_source_check check (source in ('form', 'csv', 'stewards', 'appeal'))`);

      await q(`alter table audit_events drop constraint audit_events_subject_check,
        add constraint audit_events_subject_check check (subject_type in ('protest', 'inspection', 'rules', 'results', 'entry', 'staff',
          'penalty', 'appeal', 'technical_report', 'penalty_catalogue'))`);
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`alter table audit_events drop constraint audit_events_subject_check,
        add constraint audit_events_subject_check check (subject_type in ('protest', 'inspection', 'rules', 'results', 'entry', 'staff'))`);
      await q(`alter table provisional_results drop constraint provisional_results_source_check,
        add constraint provisional_results_source_check check (source in ('form', 'csv'))`);
      await q(`alter table provisional_results drop column amendments`);
      await q(`alter table penalties drop constraint penalties_appeal_fk`);
      for (const t of ['appeals', 'penalties', 'technical_reports', 'penalty_catalogue_items', 'appeal_body_members'])
        await q(`drop table ${t}`);
      await q(`alter table events drop constraint events_appeal_fee_check, drop column appeal_fee_minor`);
    });
  },
};
