'use strict';
// Boats with their declarations, uploaded documents, QR tags, entries and processed payment events.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, INTEGER, DOUBLE, TEXT, BIGINT } = Sequelize;
    const id = { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const stamps = {
      created_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      updated_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    };
    const ref = (table, allowNull = false) => ({ type: UUID, allowNull, references: { model: table, key: 'id' }, onDelete: allowNull ? 'SET NULL' : 'CASCADE' });

    await queryInterface.createTable('boats', {
      id, owner_id: ref('users'),
      name: { type: STRING, allowNull: false },
      hull_number: { type: STRING, allowNull: false, defaultValue: '' },
      hull_description: { type: TEXT, allowNull: false, defaultValue: '' },
      pump_description: { type: TEXT, allowNull: false, defaultValue: '' },
      impeller_description: { type: TEXT, allowNull: false, defaultValue: '' },
      declared_nozzle_mm: { type: DOUBLE, allowNull: false },
      declared_nozzle_tolerance_mm: { type: DOUBLE, allowNull: false, defaultValue: 0.1 },
      engine_description: { type: TEXT, allowNull: false, defaultValue: '' },
      declared_power_kw: { type: DOUBLE, allowNull: false },
      power_evidence: { type: STRING, allowNull: false, defaultValue: 'none' },
      displacement_l: { type: DOUBLE },
      declared_weight_kg: { type: DOUBLE },
      ...stamps,
    });
    await queryInterface.addIndex('boats', ['owner_id']);
    await queryInterface.sequelize.query(`
      alter table boats
        add constraint boats_nozzle_check check (declared_nozzle_mm > 0 and declared_nozzle_mm < 1000),
        add constraint boats_power_check check (declared_power_kw > 0 and declared_power_kw < 10000),
        add constraint boats_evidence_check check (power_evidence in ('dyno_sheet', 'maker_rating', 'none'))`);

    await queryInterface.createTable('boat_documents', {
      id, boat_id: ref('boats'), uploaded_by_id: ref('users'),
      kind: { type: STRING, allowNull: false },
      object_key: { type: STRING, allowNull: false, unique: true },
      file_name: { type: STRING, allowNull: false },
      content_type: { type: STRING, allowNull: false },
      size_bytes: { type: BIGINT, allowNull: false },
      sha256: { type: STRING(64), allowNull: false },
      created_at: stamps.created_at,
    });

    await queryInterface.createTable('boat_tags', {
      id, boat_id: ref('boats'),
      token: { type: STRING, allowNull: false, unique: true },
      issued_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      retired_at: { type: DATE },
    });
    await queryInterface.addIndex('boat_tags', ['boat_id'], { unique: true, where: { retired_at: null }, name: 'boat_tags_one_current' });

    await queryInterface.createTable('entries', {
      id, event_id: ref('events'), class_id: ref('race_classes'), boat_id: ref('boats'), entrant_id: ref('users'),
      race_number: { type: INTEGER, allowNull: false },
      status: { type: STRING, allowNull: false, defaultValue: 'awaiting_payment' },
      inspection_result: { type: STRING },
      fee_minor: { type: INTEGER, allowNull: false },
      currency: { type: STRING(3), allowNull: false },
      checkout_session_id: { type: STRING, unique: true },
      payment_intent_id: { type: STRING },
      paid_at: { type: DATE },
      refunded_at: { type: DATE },
      refund_id: { type: STRING },
      cancelled_reason: { type: TEXT },
      ...stamps,
    });
    await queryInterface.addIndex('entries', ['event_id', 'race_number'], { unique: true });
    await queryInterface.addIndex('entries', ['event_id', 'boat_id'], { unique: true, where: { status: ['awaiting_payment', 'entered'] }, name: 'entries_one_live_per_boat' });
    await queryInterface.addIndex('entries', ['entrant_id']);
    await queryInterface.addIndex('entries', ['class_id']);
    await queryInterface.sequelize.query(`
      alter table entries
        add constraint entries_status_check check (status in ('awaiting_payment', 'entered', 'withdrawn', 'cancelled')),
        add constraint entries_inspection_check check (inspection_result is null or inspection_result in ('conforms', 'does_not_conform', 'inconclusive')),
        add constraint entries_race_number_check check (race_number between 1 and 9999)`);

    // Webhook events already applied, so a replayed delivery changes nothing.
    await queryInterface.createTable('payment_events', {
      id: { type: STRING, primaryKey: true },
      type: { type: STRING, allowNull: false },
      received_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    });
  },
  async down(queryInterface) {
    for (const t of ['payment_events', 'entries', 'boat_tags', 'boat_documents', 'boats']) await queryInterface.dropTable(t);
  },
};
