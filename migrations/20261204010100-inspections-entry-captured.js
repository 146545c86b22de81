'use strict';
// A new dock record is usually the entry's latest capture: "has anything of this entry been captured at or
// after it?" is then one probe of this index, not a read of every earlier record (each a page of its own:
// records are a few kilobytes of JSON), so the entry's verdict follows the new record without walking its history.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.query(
      'create index if not exists inspections_entry_captured on inspections (entry_id, captured_at)',
    );
  },
  async down(queryInterface) {
    await queryInterface.sequelize.query('drop index if exists inspections_entry_captured');
  },
};
