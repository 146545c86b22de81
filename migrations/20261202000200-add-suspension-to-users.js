'use strict';
// The site administrator can suspend an account (a scrutineer who has left, a compromised login):
// a suspended person cannot sign in, and sessions already open stop working on their next request.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('users', 'suspended_at', { type: Sequelize.DATE });
    await queryInterface.addColumn('users', 'suspended_reason', { type: Sequelize.TEXT });
    await queryInterface.addColumn('users', 'suspended_by_id', { type: Sequelize.UUID, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' });
    await queryInterface.sequelize.query(`alter table users add constraint users_suspension_check
      check ((suspended_at is null and suspended_reason is null) or (suspended_at is not null and length(coalesce(suspended_reason, '')) > 0))`);
  },
  async down(queryInterface) {
    for (const c of ['suspended_by_id', 'suspended_reason', 'suspended_at']) await queryInterface.removeColumn('users', c);
  },
};
