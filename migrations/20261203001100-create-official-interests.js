'use strict';
// The register of declared interests per meeting: an official (any staff role at the meeting)
// declares an interest in a boat, an entrant or a named team, with a short statement. Both tables
// are append-only (boreline_append_only from migration 500): a declaration is never edited, and its
// withdrawal is a second record, at most once. Also: the protest decision keeps the deciding
// officials' names as they were when they decided (decided_by_ids alone follows later renames).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, TEXT, JSONB } = Sequelize;
    const id = { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const now = { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
    const ref = (table, allowNull = false) => ({ type: UUID, allowNull, references: { model: table, key: 'id' }, onDelete: 'RESTRICT' });
    await queryInterface.createTable('official_interests', {
      id, event_id: ref('events'), official_id: ref('users'),
      subject_kind: { type: STRING, allowNull: false },
      boat_id: ref('boats', true),
      entrant_id: ref('users', true),
      team_name: { type: TEXT },
      statement: { type: TEXT, allowNull: false },
      declared_at: now,
    });
    await queryInterface.addIndex('official_interests', ['event_id', 'official_id']);
    await queryInterface.sequelize.query(`alter table official_interests
      add constraint official_interests_kind_check check (
        (subject_kind = 'boat' and boat_id is not null and entrant_id is null and team_name is null)
        or (subject_kind = 'entrant' and entrant_id is not null and boat_id is null and team_name is null)
        or (subject_kind = 'team' and length(coalesce(team_name, '')) > 0 and boat_id is null and entrant_id is null)),
      add constraint official_interests_statement_check check (length(statement) > 0)`);
    await queryInterface.createTable('official_interest_withdrawals', {
      id, interest_id: { ...ref('official_interests'), unique: true }, withdrawn_by_id: ref('users'),
      reason: { type: TEXT, allowNull: false, defaultValue: '' },
      withdrawn_at: now,
    });
    for (const t of ['official_interests', 'official_interest_withdrawals']) {
      await queryInterface.sequelize.query(`create trigger ${t}_append_only before update or delete on ${t} for each row execute function boreline_append_only();`);
    }
    await queryInterface.addColumn('protests', 'decided_by_names', { type: JSONB, allowNull: false, defaultValue: Sequelize.literal(`'[]'::jsonb`) });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('protests', 'decided_by_names');
    await queryInterface.dropTable('official_interest_withdrawals');
    await queryInterface.dropTable('official_interests');
  },
};
