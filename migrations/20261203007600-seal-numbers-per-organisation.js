'use strict';
// Seal numbers are unique within the issuing organisation's register, no longer across every meeting of
// the install: with one global index, an official of any meeting (anyone who organises at some club can
// create one) could issue another club's next bag of seal numbers first, and the refusal listed which
// numbers other registers held. Each seal now carries the organisation that issued it (from its batch's
// meeting, set by a trigger on insert); seals carried over from free text before the register have no
// batch and no issuer, as before. Numbers are compared without the leading zeros of their number part.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`alter table seals add column organisation_id uuid references organisations(id) on delete restrict`);
      // The register is append-only: the trigger steps aside for this one backfill only.
      await q(`alter table seals disable trigger seals_append_only`);
      await q(`update seals s set organisation_id = ev.organisation_id
                 from seal_batches b join events ev on ev.id = b.event_id
                where b.id = s.batch_id`);
      await q(`alter table seals enable trigger seals_append_only`);
      await q(`create function boreline_seal_issuer() returns trigger language plpgsql as $$
               begin
                 if new.batch_id is not null then
                   select ev.organisation_id into new.organisation_id
                     from seal_batches b join events ev on ev.id = b.event_id where b.id = new.batch_id;
                 end if;
                 return new;
               end $$`);
      await q(`create trigger seals_issuer before insert on seals for each row execute function boreline_seal_issuer()`);
      await q(`drop index seals_number`);
      // Exact duplicates are the database's to refuse. Numbers that differ only by leading zeros ("ZZ-01",
      // "ZZ-1") are refused by the batch check, which runs under a per-organisation lock; an index on that
      // key could not be built over registers that already hold such pairs, which older batches allowed.
      await q(`create unique index seals_number on seals (organisation_id, upper(number))`);
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`drop index seals_number`);
      await q(`create unique index seals_number on seals (upper(number))`);
      await q(`drop trigger seals_issuer on seals`);
      await q(`drop function boreline_seal_issuer()`);
      await q(`alter table seals disable trigger seals_append_only`);
      await q(`alter table seals drop column organisation_id`);
      await q(`alter table seals enable trigger seals_append_only`);
    });
  },
};
