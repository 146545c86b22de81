'use strict';
// Trust in who is signed in:
// - users.session_version: every session carries the version it was issued under; sign-out, a
//   password change, a suspension and "sign out everywhere" raise it, which ends every open session.
// - address_proofs: a one-time link mailed to a new account's address; until it is followed the
//   address is unproven (users.email_verified is null) and no staff role or fee is tied to it.
// - auth_throttles.expires_at: counters expire and are purged, instead of staying forever.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('users', 'session_version', { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 });
    await queryInterface.createTable('address_proofs', {
      id: { type: Sequelize.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
      user_id: { type: Sequelize.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      // The address the link was sent to: a proof only counts while the account still has it.
      email: { type: Sequelize.STRING, allowNull: false },
      token_hash: { type: Sequelize.STRING(64), allowNull: false, unique: true },
      expires_at: { type: Sequelize.DATE, allowNull: false },
      used_at: { type: Sequelize.DATE },
      created_at: { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.literal('now()') },
    });
    await queryInterface.addIndex('address_proofs', ['user_id']);
    await queryInterface.addColumn('auth_throttles', 'expires_at', { type: Sequelize.DATE, allowNull: false, defaultValue: Sequelize.literal('now()') });
    await queryInterface.addIndex('auth_throttles', ['expires_at']);
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('auth_throttles', 'expires_at');
    await queryInterface.dropTable('address_proofs');
    await queryInterface.removeColumn('users', 'session_version');
  },
};
