'use strict';
// A person on an entry signs on with the officials each meeting day (issue 21, item 7): one row per person
// and day, append-only, with the name and licence as they read then (no reference: the entrant may later
// change or remove the person, and the sign-on stays as it was).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, DATEONLY } = Sequelize;
    const ref = (table) => ({ type: UUID, allowNull: false, references: { model: table, key: 'id' }, onDelete: 'RESTRICT' });
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await queryInterface.createTable(
        'crew_sign_ons',
        {
          id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
          event_id: ref('events'),
          entry_id: ref('entries'),
          crew_member_id: { type: UUID, allowNull: false },
          meeting_day: { type: DATEONLY, allowNull: false },
          role: { type: STRING(10), allowNull: false },
          name: { type: STRING(120), allowNull: false },
          licence_number: { type: STRING(40) },
          signed_on_by_id: ref('users'),
          signed_on_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
        },
        { transaction },
      );
      // Once a day per person as they read then: a record whose person was replaced (another name or licence)
      // is signed on afresh, and the earlier sign-on no longer counts for it (lib/core/crew/assess-crew.ts).
      await q(`create unique index crew_sign_ons_once_a_day on crew_sign_ons (crew_member_id, meeting_day, name, coalesce(licence_number, ''))`);
      await q(`create index crew_sign_ons_entry_day on crew_sign_ons (entry_id, meeting_day)`);
      await q(`create trigger crew_sign_ons_append_only before update or delete on crew_sign_ons
        for each row execute function boreline_append_only();`);
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('crew_sign_ons');
  },
};
