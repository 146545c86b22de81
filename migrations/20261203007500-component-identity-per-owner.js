'use strict';
// A component's identity (kind, maker, serial) is unique among one owner's components, no longer across
// every owner: with one index over everybody, whoever typed a serial first held it (a rival who read a
// serial off an engine plate could register it and lock the real owner out), and the refusal told any
// entrant whether someone else's part existed. The same identity on two owners' boats is now shown to
// the officials at the dock's serial lookup as a disputed part, for them to decide.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`drop index boat_components_identity`);
      await q(
        `create unique index boat_components_identity on boat_components (created_by_id, kind, lower(maker), lower(serial_number))`,
      );
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`drop index boat_components_identity`);
      await q(`create unique index boat_components_identity on boat_components (kind, lower(maker), lower(serial_number))`);
    });
  },
};
