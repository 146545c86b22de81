'use strict';
// An appeal overtaken by another appeal's decision on the same penalty (annulled or amended) could not be decided
// any more and stayed pending: the appeal body now closes it as 'superseded' (the fee refunded, the results left as
// the other decision made them). Only the two CHECK constraints change.
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`alter table appeals drop constraint appeals_status_check, drop constraint appeals_decided_check`);
      await q(`alter table appeals
        add constraint appeals_status_check check (status in ('awaiting_fee', 'lodged', 'hearing_scheduled', 'confirmed', 'amended', 'annulled', 'superseded')),
        add constraint appeals_decided_check check ((status in ('confirmed', 'amended', 'annulled', 'superseded')) = (decided_at is not null))`);
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`alter table appeals drop constraint appeals_status_check, drop constraint appeals_decided_check`);
      await q(`alter table appeals
        add constraint appeals_status_check check (status in ('awaiting_fee', 'lodged', 'hearing_scheduled', 'confirmed', 'amended', 'annulled')),
        add constraint appeals_decided_check check ((status in ('confirmed', 'amended', 'annulled')) = (decided_at is not null))`);
    });
  },
};
