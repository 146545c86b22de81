'use strict';
// A record is corrected once: a second correction of the same record would fork its history (two records
// each claiming to restate it). The application refuses it (409 already_corrected, the correction of the
// correction is the way on); this unique index settles two corrections sent at the same moment. An install
// whose history already forked keeps its plain index and is told so in the migration's log, not broken.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    const [forks] = await queryInterface.sequelize.query(
      `select supersedes_id from inspections where supersedes_id is not null group by supersedes_id having count(*) > 1 limit 1`,
    );
    if (forks.length) {
      console.warn('[migration] inspections: a record corrected twice already exists; one correction per record is left to the application');
      return;
    }
    await queryInterface.sequelize.query(`
      drop index if exists inspections_supersedes_id;
      create unique index inspections_supersedes_id on inspections (supersedes_id) where supersedes_id is not null;`);
  },
  async down(queryInterface) {
    await queryInterface.sequelize.query(`
      drop index if exists inspections_supersedes_id;
      create index inspections_supersedes_id on inspections (supersedes_id) where supersedes_id is not null;`);
  },
};
