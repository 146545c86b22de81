'use strict';
// The record chain's self-checks (issue 24, item 5): each run of the nightly job or of the site
// administrator's button, with what it found. The admin page shows the newest; an alert stays until a
// later check finds every chain whole. Append-only.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`create table chain_self_checks (
        id bigserial primary key,
        checked_at timestamptz not null default now(),
        checked_by_id uuid references users (id) on delete restrict,
        chains integer not null,
        records bigint not null,
        broken jsonb not null default '[]'::jsonb)`);
      await q(`create trigger chain_self_checks_append_only before update or delete on chain_self_checks
                 for each row execute function boreline_append_only()`);
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('chain_self_checks');
  },
};
