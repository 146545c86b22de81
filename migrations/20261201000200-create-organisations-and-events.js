'use strict';
// Clubs, their members, race meetings, per-event staff roles and staff invitations.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, DATEONLY } = Sequelize;
    const id = { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const stamps = {
      created_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
      updated_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
    };
    const ref = (table) => ({ type: UUID, allowNull: false, references: { model: table, key: 'id' }, onDelete: 'CASCADE' });

    await queryInterface.createTable('organisations', {
      id, name: { type: STRING, allowNull: false }, slug: { type: STRING, allowNull: false, unique: true }, ...stamps,
    });
    await queryInterface.createTable('organisation_members', {
      id, organisation_id: ref('organisations'), user_id: ref('users'),
      role: { type: STRING, allowNull: false }, ...stamps,
    });
    await queryInterface.addIndex('organisation_members', ['organisation_id', 'user_id', 'role'], { unique: true });
    await queryInterface.addConstraint('organisation_members', {
      type: 'check', fields: ['role'], where: { role: ['organiser', 'member'] }, name: 'organisation_members_role_check',
    });

    await queryInterface.createTable('events', {
      id, organisation_id: ref('organisations'),
      name: { type: STRING, allowNull: false },
      slug: { type: STRING, allowNull: false, unique: true },
      venue: { type: STRING, allowNull: false },
      starts_on: { type: DATEONLY, allowNull: false },
      ends_on: { type: DATEONLY, allowNull: false },
      time_zone: { type: STRING, allowNull: false },
      status: { type: STRING, allowNull: false, defaultValue: 'draft' },
      ...stamps,
    });
    await queryInterface.addConstraint('events', {
      type: 'check', fields: ['status'], name: 'events_status_check',
      where: { status: ['draft', 'entries_open', 'entries_closed', 'racing', 'finished'] },
    });

    await queryInterface.createTable('event_staff', {
      id, event_id: ref('events'), user_id: ref('users'), role: { type: STRING, allowNull: false }, ...stamps,
    });
    await queryInterface.addIndex('event_staff', ['event_id', 'user_id', 'role'], { unique: true });
    await queryInterface.addIndex('event_staff', ['user_id']);
    await queryInterface.addConstraint('event_staff', {
      type: 'check', fields: ['role'], name: 'event_staff_role_check',
      where: { role: ['organiser', 'chief_scrutineer', 'scrutineer', 'steward'] },
    });

    await queryInterface.createTable('staff_invitations', {
      id, event_id: ref('events'),
      email: { type: STRING, allowNull: false },
      role: { type: STRING, allowNull: false },
      token_hash: { type: STRING, allowNull: false, unique: true },
      invited_by_id: ref('users'),
      expires_at: { type: DATE, allowNull: false },
      accepted_at: { type: DATE },
      ...stamps,
    });

    // Sign-in attempt counters, kept in PostgreSQL so the limit holds across app servers.
    await queryInterface.createTable('auth_throttles', {
      key: { type: STRING, primaryKey: true },
      window_started_at: { type: DATE, allowNull: false },
      attempts: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
    });
  },
  async down(queryInterface) {
    for (const t of ['auth_throttles', 'staff_invitations', 'event_staff', 'events', 'organisation_members', 'organisations']) {
      await queryInterface.dropTable(t);
    }
  },
};
