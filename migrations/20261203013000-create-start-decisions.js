'use strict';
// The organiser's decisions on the start list, per entry and meeting day: let a boat start although the
// list holds it back, or hold back a boat the list lets start, always with the reason. Append-only: a
// later decision for the same entry and day replaces the earlier one on the list, which stays in the record.
// A "may start" covers the holds it saw (holds_seen), not holds that arise after it.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, DATEONLY, DATE, TEXT, BOOLEAN } = Sequelize;
    const ref = (table) => ({ type: UUID, allowNull: false, references: { model: table, key: 'id' }, onDelete: 'RESTRICT' });
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await queryInterface.createTable(
        'start_decisions',
        {
          id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
          event_id: ref('events'),
          entry_id: ref('entries'),
          day: { type: DATEONLY, allowNull: false },
          may_start: { type: BOOLEAN, allowNull: false },
          reason: { type: TEXT, allowNull: false },
          // What held the boat when the decision was made: a "may start" covers those holds only, so a hold
          // that arises later (an incident's re-inspection, an expired item) holds the boat again.
          holds_seen: { type: Sequelize.JSONB, allowNull: false, defaultValue: Sequelize.literal(`'[]'::jsonb`) },
          decided_by_id: ref('users'),
          decided_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
        },
        { transaction },
      );
      await q(`alter table start_decisions
        add constraint start_decisions_reason_check check (char_length(btrim(reason)) between 3 and 500)`);
      await q(`create index start_decisions_entry_day on start_decisions (entry_id, day, decided_at desc)`);
      await q(`create index start_decisions_event_day on start_decisions (event_id, day)`);
      await q(`create trigger start_decisions_append_only before update or delete on start_decisions
        for each row execute function boreline_append_only();`);
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('start_decisions');
  },
};
