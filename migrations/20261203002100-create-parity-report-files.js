'use strict';
// Files made from a published parity report (its PDF), rendered once and kept in object storage
// with their SHA-256. One row per report and kind (the unique index decides between two first
// requests rendering at once); append-only like the report itself.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, INTEGER } = Sequelize;
    await queryInterface.createTable('parity_report_files', {
      id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
      report_id: { type: UUID, allowNull: false, references: { model: 'parity_reports', key: 'id' }, onDelete: 'RESTRICT' },
      kind: { type: STRING(16), allowNull: false },
      object_key: { type: STRING, allowNull: false, unique: true },
      sha256: { type: STRING(64), allowNull: false },
      size_bytes: { type: INTEGER, allowNull: false },
      content_type: { type: STRING, allowNull: false },
      created_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });
    await queryInterface.addIndex('parity_report_files', ['report_id', 'kind'], { unique: true });
    await queryInterface.sequelize.query(`alter table parity_report_files add constraint parity_report_files_kind_check check (kind in ('pdf'))`);
    await queryInterface.sequelize.query(`alter table parity_report_files add constraint parity_report_files_sha256_check check (sha256 ~ '^[0-9a-f]{64}$')`);
    await queryInterface.sequelize.query(`create trigger parity_report_files_append_only before update or delete on parity_report_files
      for each row execute function boreline_append_only();`);
  },
  async down(queryInterface) {
    await queryInterface.dropTable('parity_report_files');
  },
};
