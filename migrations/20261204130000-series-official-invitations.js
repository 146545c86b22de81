'use strict';
// Invitations to a series role live beside invitations to a meeting's staff, in staff_invitations: one token
// space, one acceptance page (/invite/<token>) and one sign-in provider serve both. A row names exactly one
// meeting (event_id, a meeting staff role) or one series (series_id, a series official's role).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`alter table staff_invitations alter column event_id drop not null`);
      await q(`alter table staff_invitations add column series_id uuid references series (id) on delete cascade`);
      await q(`alter table staff_invitations add constraint staff_invitations_scope_check check (
        (event_id is not null and series_id is null
          and role in ('organiser', 'chief_scrutineer', 'scrutineer', 'steward'))
        or (event_id is null and series_id is not null and role in ('series_secretary', 'series_steward')))`);
      await q(`create index staff_invitations_series on staff_invitations (series_id) where series_id is not null`);
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`delete from staff_invitations where series_id is not null`);
      await q(`alter table staff_invitations drop constraint staff_invitations_scope_check`);
      await q(`alter table staff_invitations drop column series_id`);
      await q(`alter table staff_invitations alter column event_id set not null`);
    });
  },
};
