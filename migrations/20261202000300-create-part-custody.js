'use strict';
// Parts held by the officials: a part removed from a boat (after damage, or for a protest) is taken
// into custody, usually in a sealed bag, and released when nothing is pending (common practice).
// Both tables are append-only (the trigger function from migration 500): an item is never edited,
// and its release is a second record, once.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, TEXT } = Sequelize;
    const id = { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const now = { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
    const ref = (table, allowNull = false) => ({ type: UUID, allowNull, references: { model: table, key: 'id' }, onDelete: allowNull ? 'SET NULL' : 'RESTRICT' });
    await queryInterface.createTable('custody_items', {
      id, event_id: ref('events'), entry_id: ref('entries'), protest_id: ref('protests', true),
      description: { type: TEXT, allowNull: false },
      seal_number: { type: STRING },
      taken_by_id: ref('users'),
      taken_at: now,
    });
    await queryInterface.addIndex('custody_items', ['event_id', 'taken_at']);
    await queryInterface.createTable('custody_releases', {
      id, item_id: { ...ref('custody_items'), unique: true }, released_by_id: ref('users'),
      released_to: { type: TEXT, allowNull: false },
      note: { type: TEXT, allowNull: false, defaultValue: '' },
      released_at: now,
    });
    await queryInterface.sequelize.query(`alter table custody_items add constraint custody_items_description_check check (length(description) > 0)`);
    await queryInterface.sequelize.query(`alter table custody_releases add constraint custody_releases_to_check check (length(released_to) > 0)`);
    for (const t of ['custody_items', 'custody_releases']) {
      await queryInterface.sequelize.query(`create trigger ${t}_append_only before update or delete on ${t} for each row execute function boreline_append_only();`);
    }
  },
  async down(queryInterface) {
    await queryInterface.dropTable('custody_releases');
    await queryInterface.dropTable('custody_items');
  },
};
