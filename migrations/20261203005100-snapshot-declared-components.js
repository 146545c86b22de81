'use strict';
// A declaration version names its components as they were when the version was made: a component's
// maker, model and trim code can be edited later (boat_components keeps only its current state), and
// "what changed since the inspected version" must compare what was declared then with what is now.
// The table is append-only and empty before this migration (nothing wrote to it yet), so the copied
// columns are filled only by new rows.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.query(`
      alter table declaration_version_components
        add column kind varchar(16) not null default '',
        add column maker text not null default '',
        add column model text not null default '',
        add column serial_number text not null default '',
        add column trim_code text not null default ''`);
  },
  async down(queryInterface) {
    await queryInterface.sequelize.query(`
      alter table declaration_version_components
        drop column kind, drop column maker, drop column model, drop column serial_number, drop column trim_code`);
  },
};
