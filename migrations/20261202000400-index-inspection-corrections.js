'use strict';
// Which record counts for an entry (currentInspectionCte in lib/server/inspections/inspection-view.ts)
// follows corrections by supersedes_id and asks of every record whether something supersedes it.
// Without an index each of those lookups scanned the entry's records, so recording slowed down as an
// entry's history grew (seen in bench:inspections); with it they are index lookups.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.addIndex('inspections', ['supersedes_id'], { name: 'inspections_supersedes_id', where: { supersedes_id: { [require('sequelize').Op.ne]: null } } });
  },
  async down(queryInterface) {
    await queryInterface.removeIndex('inspections', 'inspections_supersedes_id');
  },
};
