'use strict';
// Measuring instruments per event, append-only inspection records with their photos,
// and re-inspection tasks. Inspections are never updated or deleted (a trigger refuses it);
// a correction is a new record that names the one it supersedes.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, DOUBLE, TEXT, JSONB, BIGINT } = Sequelize;
    const id = { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const now = { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
    const ref = (table, allowNull = false) => ({ type: UUID, allowNull, references: { model: table, key: 'id' }, onDelete: allowNull ? 'SET NULL' : 'RESTRICT' });

    await queryInterface.createTable('instruments', {
      id, event_id: { type: UUID, allowNull: false, references: { model: 'events', key: 'id' }, onDelete: 'CASCADE' },
      name: { type: STRING, allowNull: false },
      quantity: { type: STRING, allowNull: false }, // 'length' (mm) or 'mass' (kg)
      error_limit: { type: DOUBLE }, // rectangular error limit a, in the quantity's unit
      resolution: { type: DOUBLE }, // digital resolution delta
      expanded_uncertainty: { type: DOUBLE }, // a ready U (k = 2) instead of a and delta
      retired_at: { type: DATE },
      created_at: now, updated_at: now,
    });
    await queryInterface.sequelize.query(`
      alter table instruments
        add constraint instruments_quantity_check check (quantity in ('length', 'mass')),
        add constraint instruments_budget_check check (expanded_uncertainty is not null or error_limit is not null or resolution is not null)`);

    await queryInterface.createTable('inspections', {
      id,
      event_id: ref('events'), entry_id: ref('entries'), boat_id: ref('boats'), class_id: ref('race_classes'),
      rule_version_id: ref('class_rule_versions'),
      kind: { type: STRING, allowNull: false, defaultValue: 'pre_race' },
      recorded_by_id: ref('users'),
      device: { type: STRING, allowNull: false, defaultValue: '' },
      idempotency_key: { type: STRING, allowNull: false, unique: true },
      captured_at: { type: DATE, allowNull: false }, // when the scrutineer recorded it (device clock)
      received_at: now, // when the server stored it
      supersedes_id: ref('inspections', true),
      correction_reason: { type: TEXT },
      reinspection_id: { type: UUID },
      measurements: { type: JSONB, allowNull: false },
      results: { type: JSONB, allowNull: false },
      overall_result: { type: STRING, allowNull: false },
      notes: { type: TEXT, allowNull: false, defaultValue: '' },
    });
    await queryInterface.addIndex('inspections', ['entry_id', 'received_at']);
    await queryInterface.addIndex('inspections', ['event_id', 'received_at']);
    await queryInterface.sequelize.query(`
      alter table inspections
        add constraint inspections_kind_check check (kind in ('pre_race', 'post_race', 'protest', 'spot_check')),
        add constraint inspections_result_check check (overall_result in ('conforms', 'does_not_conform', 'inconclusive')),
        add constraint inspections_correction_check check (supersedes_id is null or length(coalesce(correction_reason, '')) > 0);
      create function boreline_append_only() returns trigger language plpgsql as $$
      begin
        raise exception '% records are append-only', tg_table_name using errcode = 'P0001';
      end $$;
      create trigger inspections_append_only before update or delete on inspections
        for each row execute function boreline_append_only();`);

    await queryInterface.createTable('inspection_photos', {
      id, inspection_id: ref('inspections'),
      object_key: { type: STRING, allowNull: false, unique: true },
      content_type: { type: STRING, allowNull: false },
      size_bytes: { type: BIGINT, allowNull: false },
      sha256: { type: STRING(64), allowNull: false },
      created_at: now,
    });
    await queryInterface.sequelize.query(`create trigger inspection_photos_append_only before update or delete on inspection_photos
      for each row execute function boreline_append_only();`);

    await queryInterface.createTable('reinspections', {
      id, event_id: { type: UUID, allowNull: false, references: { model: 'events', key: 'id' }, onDelete: 'CASCADE' },
      entry_id: ref('entries'),
      reason: { type: TEXT, allowNull: false },
      requested_by_id: ref('users'),
      protest_id: { type: UUID },
      inspection_id: ref('inspections', true),
      done_at: { type: DATE },
      created_at: now, updated_at: now,
    });
    await queryInterface.addIndex('reinspections', ['event_id', 'done_at']);
  },
  async down(queryInterface) {
    await queryInterface.dropTable('reinspections');
    await queryInterface.dropTable('inspection_photos');
    await queryInterface.dropTable('inspections');
    await queryInterface.sequelize.query('drop function if exists boreline_append_only()');
    await queryInterface.dropTable('instruments');
  },
};
