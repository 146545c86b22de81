'use strict';
// Instruments with calibration. An instrument gains what identifies it (type, serial, measuring
// range, material); a calibration certificate (number, laboratory, calibrated on, due on, stated
// expanded uncertainty U with its k, the certificate's file in object storage with its SHA-256) and a
// daily check against a reference (gauge block or check weight, on one meeting day) are records of
// their own. Both tables are append-only (boreline_append_only from migration 500): a wrong
// certificate is followed by a correct one, never edited. Existing instruments keep every figure and
// simply have no certificate on file.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, DATEONLY, TEXT, DOUBLE, BOOLEAN, BIGINT } = Sequelize;
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      const id = { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
      const now = { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
      const ref = (table) => ({ type: UUID, allowNull: false, references: { model: table, key: 'id' }, onDelete: 'RESTRICT' });
      await queryInterface.addColumn('instruments', 'instrument_type', { type: STRING(40) }, { transaction });
      await queryInterface.addColumn('instruments', 'serial', { type: STRING(80) }, { transaction });
      await queryInterface.addColumn('instruments', 'range_min', { type: DOUBLE }, { transaction });
      await queryInterface.addColumn('instruments', 'range_max', { type: DOUBLE }, { transaction });
      await queryInterface.addColumn('instruments', 'material', { type: STRING(40) }, { transaction });
      await queryInterface.createTable(
        'calibration_certificates',
        {
          id,
          instrument_id: ref('instruments'),
          number: { type: STRING(80), allowNull: false },
          laboratory: { type: STRING(160), allowNull: false },
          calibrated_on: { type: DATEONLY, allowNull: false },
          due_on: { type: DATEONLY, allowNull: false },
          expanded_uncertainty: { type: DOUBLE },
          coverage_factor: { type: DOUBLE, allowNull: false, defaultValue: 2 },
          object_key: { type: STRING, unique: true },
          content_type: { type: STRING },
          size_bytes: { type: BIGINT },
          sha256: { type: STRING(64) },
          added_by_id: ref('users'),
          created_at: now,
        },
        { transaction },
      );
      await q(`alter table calibration_certificates add constraint calibration_certificates_dates_check check (due_on > calibrated_on)`);
      await q(`alter table calibration_certificates add constraint calibration_certificates_u_check check (expanded_uncertainty is null or expanded_uncertainty >= 0)`);
      await q(`alter table calibration_certificates add constraint calibration_certificates_k_check check (coverage_factor > 0)`);
      await q(`alter table calibration_certificates add constraint calibration_certificates_file_check check ((object_key is null) = (sha256 is null))`);
      await queryInterface.addIndex('calibration_certificates', ['instrument_id', 'created_at'], { transaction });
      await queryInterface.createTable(
        'instrument_checks',
        {
          id,
          instrument_id: ref('instruments'),
          meeting_day: { type: DATEONLY, allowNull: false },
          reference: { type: TEXT, allowNull: false },
          nominal_value: { type: DOUBLE, allowNull: false },
          reading: { type: DOUBLE, allowNull: false },
          passed: { type: BOOLEAN, allowNull: false },
          checked_by_id: ref('users'),
          checked_at: now,
        },
        { transaction },
      );
      await q(`alter table instrument_checks add constraint instrument_checks_reference_check check (length(reference) > 0)`);
      await queryInterface.addIndex('instrument_checks', ['instrument_id', 'meeting_day', 'checked_at'], { transaction });
      for (const t of ['calibration_certificates', 'instrument_checks']) {
        await q(`create trigger ${t}_append_only before update or delete on ${t} for each row execute function boreline_append_only();`);
      }
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      await queryInterface.dropTable('instrument_checks', { transaction });
      await queryInterface.dropTable('calibration_certificates', { transaction });
      for (const c of ['material', 'range_max', 'range_min', 'serial', 'instrument_type'])
        await queryInterface.removeColumn('instruments', c, { transaction });
    });
  },
};
