'use strict';
// Run times from the timing sheet (CSV import or typed by hand): one row per run of a boat over a course,
// append-only like results. A row's key is (class, race number, run); a re-import of the same figures stores
// nothing, different figures are a correction: a new row that supersedes the current one (supersedes_id,
// at most one correction per row). The current run of a key is the row nothing supersedes.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, INTEGER, TEXT, DOUBLE } = Sequelize;
    const ref = (table, allowNull = false) => ({ type: UUID, allowNull, references: { model: table, key: 'id' }, onDelete: 'RESTRICT' });
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await queryInterface.createTable(
        'run_times',
        {
          id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
          event_id: ref('events'),
          class_id: ref('race_classes'),
          entry_id: ref('entries'),
          race_number: { type: INTEGER, allowNull: false },
          run_label: { type: STRING(20), allowNull: false },
          course_length_m: { type: DOUBLE, allowNull: false },
          elapsed_s: { type: DOUBLE, allowNull: false },
          trap_speed_ms: { type: DOUBLE },
          gps_top_speed_ms: { type: DOUBLE },
          rpm: { type: INTEGER },
          conditions: { type: TEXT, allowNull: false, defaultValue: '' },
          source: { type: STRING(10), allowNull: false },
          supersedes_id: ref('run_times', true),
          recorded_by_id: ref('users'),
          recorded_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
        },
        { transaction },
      );
      await q(`alter table run_times
        add constraint run_times_source_check check (source in ('csv', 'form')),
        add constraint run_times_elapsed_check check (elapsed_s > 0 and elapsed_s <= 3600),
        add constraint run_times_course_check check (course_length_m > 0 and course_length_m <= 20000),
        add constraint run_times_trap_check check (trap_speed_ms is null or (trap_speed_ms > 0 and trap_speed_ms <= 150)),
        add constraint run_times_gps_check check (gps_top_speed_ms is null or (gps_top_speed_ms > 0 and gps_top_speed_ms <= 150)),
        add constraint run_times_rpm_check check (rpm is null or (rpm > 0 and rpm <= 30000)),
        add constraint run_times_race_number_check check (race_number between 1 and 9999)`);
      // The import key: one original row per class, race number and run; corrections carry supersedes_id.
      await q(`create unique index run_times_import_key on run_times (class_id, race_number, run_label) where supersedes_id is null`);
      await q(`create unique index run_times_supersedes on run_times (supersedes_id) where supersedes_id is not null`);
      await q(`create index run_times_event_class on run_times (event_id, class_id)`);
      await q(`create trigger run_times_append_only before update or delete on run_times
        for each row execute function boreline_append_only();`);
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('run_times');
  },
};
