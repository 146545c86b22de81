'use strict';
// People, and the tables next-auth's adapter uses (accounts, sessions, verification tokens).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, TEXT, INTEGER, DATE, BOOLEAN } = Sequelize;
    const fn = (name) => Sequelize.fn(name);
    await queryInterface.createTable('users', {
      id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
      name: { type: STRING },
      email: { type: STRING, allowNull: false, unique: true },
      email_verified: { type: DATE },
      image: { type: STRING },
      password_hash: { type: STRING },
      is_admin: { type: BOOLEAN, allowNull: false, defaultValue: false },
      created_at: { type: DATE, allowNull: false, defaultValue: fn('now') },
      updated_at: { type: DATE, allowNull: false, defaultValue: fn('now') },
    });
    await queryInterface.createTable('accounts', {
      id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
      type: { type: STRING, allowNull: false },
      provider: { type: STRING, allowNull: false },
      provider_account_id: { type: STRING, allowNull: false },
      refresh_token: { type: STRING },
      access_token: { type: STRING },
      expires_at: { type: INTEGER },
      token_type: { type: STRING },
      scope: { type: STRING },
      id_token: { type: TEXT },
      session_state: { type: STRING },
      user_id: { type: UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    });
    await queryInterface.addIndex('accounts', ['provider', 'provider_account_id'], { unique: true });
    await queryInterface.createTable('sessions', {
      id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
      expires: { type: DATE, allowNull: false },
      session_token: { type: STRING, allowNull: false, unique: true },
      user_id: { type: UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    });
    await queryInterface.createTable('verification_tokens', {
      token: { type: STRING, primaryKey: true },
      identifier: { type: STRING, allowNull: false },
      expires: { type: DATE, allowNull: false },
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('verification_tokens');
    await queryInterface.dropTable('sessions');
    await queryInterface.dropTable('accounts');
    await queryInterface.dropTable('users');
  },
};
