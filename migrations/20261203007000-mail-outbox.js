'use strict';
// The mail outbox: a message to send is a row written in the same transaction as what it reports
// (a rolled-back record sends nothing), and a worker in each app server sends it after the answer
// (lib/server/mail/outbox-worker.ts). Rows are claimed with FOR UPDATE SKIP LOCKED, so several app
// servers never send one twice; a failed send stays here with its error and is tried again later
// (attempts, next_attempt_at), so a mail relay that is slow or down never slows or loses anything.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, TEXT, INTEGER } = Sequelize;
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await queryInterface.createTable(
        'mail_outbox',
        {
          id: { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') },
          // What wrote it (inspection_result, declaration_change, ...): for the operators' counts only.
          kind: { type: STRING(40), allowNull: false },
          to_address: { type: STRING(320), allowNull: false },
          subject: { type: TEXT, allowNull: false },
          text_body: { type: TEXT, allowNull: false },
          html_body: { type: TEXT },
          attempts: { type: INTEGER, allowNull: false, defaultValue: 0 },
          next_attempt_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
          last_error: { type: TEXT },
          // Set when the relay accepted it; failed_at when the worker gave up retrying (the row stays).
          sent_at: { type: DATE },
          failed_at: { type: DATE },
          created_at: { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') },
        },
        { transaction },
      );
      await q(`alter table mail_outbox add constraint mail_outbox_attempts_check check (attempts >= 0)`);
      await q(`alter table mail_outbox add constraint mail_outbox_done_check check (sent_at is null or failed_at is null)`);
      // The worker's lookup: only rows still to send, oldest due first (a small partial index, whatever the history).
      await q(`create index mail_outbox_due on mail_outbox (next_attempt_at) where sent_at is null and failed_at is null`);
      await q(`create index mail_outbox_created on mail_outbox (created_at)`);
    });
  },
  async down(queryInterface) {
    await queryInterface.dropTable('mail_outbox');
  },
};
