'use strict';
// The people on an entry (driver, navigator, reserves) with their licence, medical certificate, date of
// birth and a guardian's consent for a minor; their dated safety gear and the boat's; the licence grades a
// class or meeting accepts; and the dock's confirmations of gear per meeting day (append-only, each with
// the item as it read when confirmed, so a changed item no longer counts as confirmed).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, DATEONLY, INTEGER, BOOLEAN, TEXT, JSONB } = Sequelize;
    const ref = (table, allowNull = false, onDelete = 'RESTRICT') => ({
      type: UUID,
      allowNull,
      references: { model: table, key: 'id' },
      onDelete,
    });
    const now = { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await queryInterface.createTable(
        'crew_requirements',
        {
          id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
          event_id: ref('events'),
          class_id: ref('race_classes', true),
          accepted_licence_grades: { type: JSONB, allowNull: false, defaultValue: [] },
          navigator_required: { type: BOOLEAN, allowNull: false, defaultValue: false },
          updated_by_id: ref('users'),
          created_at: now,
          updated_at: now,
        },
        { transaction },
      );
      await q(`create unique index crew_requirements_class on crew_requirements (event_id, class_id) where class_id is not null`);
      await q(`create unique index crew_requirements_meeting on crew_requirements (event_id) where class_id is null`);
      await q(`alter table crew_requirements add constraint crew_requirements_grades_check
        check (jsonb_typeof(accepted_licence_grades) = 'array' and jsonb_array_length(accepted_licence_grades) <= 20)`);

      await queryInterface.createTable(
        'entry_crew_members',
        {
          id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
          entry_id: ref('entries', false, 'CASCADE'),
          position: { type: INTEGER, allowNull: false },
          role: { type: STRING(10), allowNull: false },
          user_id: ref('users', true),
          name: { type: STRING(120), allowNull: false },
          born_on: { type: DATEONLY, allowNull: false },
          licence_issued_by: { type: STRING(80) },
          licence_grade: { type: STRING(20) },
          licence_number: { type: STRING(40) },
          licence_expires_on: { type: DATEONLY },
          medical_expires_on: { type: DATEONLY },
          guardian_name: { type: STRING(120) },
          guardian_consent_on: { type: DATEONLY },
          created_at: now,
          updated_at: now,
        },
        { transaction },
      );
      await q(`alter table entry_crew_members
        add constraint entry_crew_members_role_check check (role in ('driver', 'navigator', 'reserve')),
        add constraint entry_crew_members_licence_check check (
          (licence_number is null) = (licence_grade is null) and (licence_number is null) = (licence_issued_by is null)
          and (licence_number is null) = (licence_expires_on is null)),
        add constraint entry_crew_members_guardian_check check ((guardian_name is null) = (guardian_consent_on is null)),
        add constraint entry_crew_members_dates_check check (
          born_on between '1900-01-01' and '2099-12-31'
          and (licence_expires_on is null or licence_expires_on between '1900-01-01' and '2099-12-31')
          and (medical_expires_on is null or medical_expires_on between '1900-01-01' and '2099-12-31')
          and (guardian_consent_on is null or guardian_consent_on between '1900-01-01' and '2099-12-31'))`);
      await q(`create unique index entry_crew_members_one_driver on entry_crew_members (entry_id) where role = 'driver'`);
      await q(`create unique index entry_crew_members_one_navigator on entry_crew_members (entry_id) where role = 'navigator'`);
      await q(`create index entry_crew_members_entry on entry_crew_members (entry_id, position)`);

      await queryInterface.createTable(
        'entry_gear_items',
        {
          id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
          entry_id: ref('entries', false, 'CASCADE'),
          crew_member_id: ref('entry_crew_members', true, 'CASCADE'),
          position: { type: INTEGER, allowNull: false },
          kind: { type: STRING(20), allowNull: false },
          standard: { type: STRING(60), allowNull: false },
          serial: { type: STRING(60), allowNull: false },
          date_kind: { type: STRING(12), allowNull: false },
          due_on: { type: DATEONLY, allowNull: false },
          created_at: now,
          updated_at: now,
        },
        { transaction },
      );
      await q(`alter table entry_gear_items
        add constraint entry_gear_items_kind_check check (
          (crew_member_id is not null and kind in ('helmet', 'harness', 'life_jacket'))
          or (crew_member_id is null and kind in ('fire_extinguisher', 'first_aid_kit'))),
        add constraint entry_gear_items_date_kind_check check (date_kind in ('expires', 'service_due')),
        add constraint entry_gear_items_due_check check (due_on between '1900-01-01' and '2099-12-31')`);
      await q(`create index entry_gear_items_entry on entry_gear_items (entry_id, position)`);

      await queryInterface.createTable(
        'gear_checks',
        {
          id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
          event_id: ref('events'),
          entry_id: ref('entries'),
          // No reference: the entrant may remove the item later and the check stays as it was.
          gear_item_id: { type: UUID, allowNull: false },
          meeting_day: { type: DATEONLY, allowNull: false },
          outcome: { type: STRING(16), allowNull: false },
          kind: { type: STRING(20), allowNull: false },
          standard: { type: STRING(60), allowNull: false },
          serial: { type: STRING(60), allowNull: false },
          due_on: { type: DATEONLY, allowNull: false },
          note: { type: TEXT, allowNull: false, defaultValue: '' },
          checked_by_id: ref('users'),
          checked_at: now,
        },
        { transaction },
      );
      await q(`alter table gear_checks
        add constraint gear_checks_outcome_check check (outcome in ('confirmed', 'not_presented', 'not_as_declared')),
        add constraint gear_checks_note_check check (length(note) <= 300)`);
      await q(`create index gear_checks_entry_day on gear_checks (entry_id, meeting_day)`);
      await q(`create trigger gear_checks_append_only before update or delete on gear_checks
        for each row execute function boreline_append_only();`);
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('gear_checks');
    await queryInterface.dropTable('entry_gear_items');
    await queryInterface.dropTable('entry_crew_members');
    await queryInterface.dropTable('crew_requirements');
  },
};
