'use strict';
// Provisional results (numbered versions per class), protests with their fee and decision,
// append-only protest evidence, and the append-only audit trail. Evidence and audit rows are never
// updated or deleted (the trigger function from migration 500 refuses it); a results version is
// never changed either: a correction is a new version, which restarts the protest window for the
// entries it changed.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, INTEGER, TEXT, JSONB, BIGINT } = Sequelize;
    const id = { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const now = { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
    const ref = (table, allowNull = false) => ({ type: UUID, allowNull, references: { model: table, key: 'id' }, onDelete: allowNull ? 'SET NULL' : 'RESTRICT' });
    const appendOnly = (table) => queryInterface.sequelize.query(`create trigger ${table}_append_only before update or delete on ${table}
      for each row execute function boreline_append_only();`);

    await queryInterface.createTable('provisional_results', {
      id, event_id: ref('events'), class_id: ref('race_classes'),
      version: { type: INTEGER, allowNull: false },
      published_at: now,
      published_by_id: ref('users'),
      rows: { type: JSONB, allowNull: false }, // [{ position, raceNumber, entryId }]
      // Entries whose row appeared, moved or went away against the previous version: their window restarts.
      changed_entry_ids: { type: JSONB, allowNull: false, defaultValue: Sequelize.literal(`'[]'::jsonb`) },
      source: { type: STRING, allowNull: false },
      note: { type: TEXT, allowNull: false, defaultValue: '' },
    });
    await queryInterface.addIndex('provisional_results', ['class_id', 'version'], { unique: true });
    await queryInterface.addIndex('provisional_results', ['event_id', 'published_at']);
    await queryInterface.sequelize.query(`alter table provisional_results
      add constraint provisional_results_source_check check (source in ('form', 'csv')),
      add constraint provisional_results_version_check check (version >= 1)`);
    await appendOnly('provisional_results');

    await queryInterface.createTable('protests', {
      id, event_id: ref('events'), lodged_by_id: ref('users'),
      against_entry_id: ref('entries', true),
      against_result_id: ref('provisional_results', true),
      results_version_id: ref('provisional_results', true), // the version whose publication opened the window
      matter_key: { type: STRING, allowNull: false },
      rule_reference: { type: STRING, allowNull: false },
      grounds: { type: TEXT, allowNull: false },
      requested_checks: { type: JSONB, allowNull: false, defaultValue: Sequelize.literal(`'[]'::jsonb`) },
      status: { type: STRING, allowNull: false, defaultValue: 'awaiting_fee' },
      fee_minor: { type: INTEGER, allowNull: false },
      currency: { type: STRING(3), allowNull: false },
      checkout_session_id: { type: STRING, unique: true },
      payment_intent_id: { type: STRING },
      paid_at: { type: DATE },
      refund_id: { type: STRING },
      refunded_at: { type: DATE },
      window_deadline: { type: DATE, allowNull: false },
      rejection_code: { type: STRING },
      hearing_at: { type: DATE },
      hearing_place: { type: STRING },
      decision_reasons: { type: TEXT },
      penalty: { type: TEXT },
      decided_at: { type: DATE },
      decided_by_ids: { type: JSONB, allowNull: false, defaultValue: Sequelize.literal(`'[]'::jsonb`) },
      appeal_deadline: { type: DATE },
      created_at: now, updated_at: now,
    });
    // One protest per entrant per matter, at one meeting.
    await queryInterface.addIndex('protests', ['event_id', 'lodged_by_id', 'matter_key'], { unique: true, name: 'protests_one_per_matter' });
    await queryInterface.addIndex('protests', ['event_id', 'status']);
    await queryInterface.addIndex('protests', ['against_entry_id']);
    await queryInterface.sequelize.query(`alter table protests
      add constraint protests_status_check check (status in ('awaiting_fee', 'lodged', 'accepted', 'rejected', 'hearing_scheduled', 'upheld', 'dismissed', 'withdrawn')),
      add constraint protests_target_check check (against_entry_id is not null or against_result_id is not null),
      add constraint protests_fee_check check (fee_minor >= 0),
      add constraint protests_rejection_check check (rejection_code is null or rejection_code in ('out_of_time', 'no_fee', 'wrong_form')),
      add constraint protests_grounds_check check (length(grounds) > 0)`);

    await queryInterface.createTable('protest_evidence', {
      id, protest_id: ref('protests'), added_by_id: ref('users'),
      kind: { type: STRING, allowNull: false },
      object_key: { type: STRING, unique: true },
      file_name: { type: STRING },
      content_type: { type: STRING },
      size_bytes: { type: BIGINT },
      sha256: { type: STRING(64) },
      inspection_id: ref('inspections', true),
      note: { type: TEXT },
      created_at: now,
    });
    await queryInterface.addIndex('protest_evidence', ['protest_id', 'created_at']);
    await queryInterface.sequelize.query(`alter table protest_evidence
      add constraint protest_evidence_kind_check check (
        (kind = 'file' and object_key is not null and sha256 is not null and size_bytes is not null and content_type is not null)
        or (kind = 'inspection_link' and inspection_id is not null)
        or (kind = 'note' and length(coalesce(note, '')) > 0))`);
    await appendOnly('protest_evidence');

    await queryInterface.createTable('audit_events', {
      id: { type: BIGINT, primaryKey: true, autoIncrement: true },
      at: now,
      event_id: ref('events'), // the meeting the subject belongs to: the trail is read per meeting
      actor_id: ref('users', true), // null for the payment provider's webhook
      subject_type: { type: STRING, allowNull: false },
      subject_id: { type: UUID, allowNull: false },
      action: { type: STRING, allowNull: false },
      details: { type: JSONB, allowNull: false, defaultValue: Sequelize.literal(`'{}'::jsonb`) },
    });
    await queryInterface.addIndex('audit_events', ['event_id', 'id']);
    await queryInterface.addIndex('audit_events', ['subject_type', 'subject_id']);
    await queryInterface.sequelize.query(`alter table audit_events
      add constraint audit_events_subject_check check (subject_type in ('protest', 'inspection', 'rules', 'results', 'entry'))`);
    await appendOnly('audit_events');
  },
  async down(queryInterface) {
    for (const t of ['audit_events', 'protest_evidence', 'protests', 'provisional_results']) await queryInterface.dropTable(t);
  },
};
