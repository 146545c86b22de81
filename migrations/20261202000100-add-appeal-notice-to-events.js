'use strict';
// Each meeting sets how long after a stewards' decision notice of appeal may be given (the
// governing body's rules decide the figure; 60 minutes was the fixed value before).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('events', 'appeal_notice_minutes', { type: Sequelize.INTEGER, allowNull: false, defaultValue: 60 });
    await queryInterface.sequelize.query(`alter table events add constraint events_appeal_notice_check check (appeal_notice_minutes between 0 and 10080)`);
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('events', 'appeal_notice_minutes');
  },
};
