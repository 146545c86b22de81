'use strict';
// Published class parity reports: numbered, immutable versions with their inputs and results.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, INTEGER, TEXT, JSONB } = Sequelize;
    await queryInterface.createTable('parity_reports', {
      id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
      event_id: { type: UUID, allowNull: false, references: { model: 'events', key: 'id' }, onDelete: 'RESTRICT' },
      class_id: { type: UUID, allowNull: false, references: { model: 'race_classes', key: 'id' }, onDelete: 'RESTRICT' },
      number: { type: INTEGER, allowNull: false },
      public_id: { type: STRING, allowNull: false, unique: true },
      rule_version_id: { type: UUID, allowNull: false, references: { model: 'class_rule_versions', key: 'id' }, onDelete: 'RESTRICT' },
      note: { type: TEXT, allowNull: false, defaultValue: '' },
      inputs: { type: JSONB, allowNull: false },
      results: { type: JSONB, allowNull: false },
      published_by_id: { type: UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
      published_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });
    await queryInterface.addIndex('parity_reports', ['class_id', 'number'], { unique: true });
    await queryInterface.sequelize.query(`create trigger parity_reports_append_only before update or delete on parity_reports
      for each row execute function boreline_append_only();`);
  },
  async down(queryInterface) {
    await queryInterface.dropTable('parity_reports');
  },
};
