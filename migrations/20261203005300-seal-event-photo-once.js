'use strict';
// A seal event's photo is taken at the dock with the inspection and uploaded after the record is
// stored (lib/server/inspections/add-inspection-photos.ts: the dock sends the record first, then each
// photo), so the event exists before its photo does. seal_events stays append-only with one exception:
// photo_id may be filled once, from empty, with a photo of the event's own inspection, and nothing
// else of the row may change. Every other update and every delete is refused as before.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q(`create function boreline_seal_event_photo_once() returns trigger language plpgsql as $$
               begin
                 if tg_op = 'UPDATE' and old.photo_id is null and new.photo_id is not null
                    and (to_jsonb(new) - 'photo_id') = (to_jsonb(old) - 'photo_id')
                    and exists (select 1 from inspection_photos p where p.id = new.photo_id and p.inspection_id = old.inspection_id) then
                   return new;
                 end if;
                 raise exception '% records are append-only', tg_table_name using errcode = 'P0001';
               end $$`);
      await q('drop trigger seal_events_append_only on seal_events');
      await q(`create trigger seal_events_append_only before update or delete on seal_events
                 for each row execute function boreline_seal_event_photo_once()`);
    });
  },
  async down(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await q('drop trigger seal_events_append_only on seal_events');
      await q(`create trigger seal_events_append_only before update or delete on seal_events
                 for each row execute function boreline_append_only()`);
      await q('drop function boreline_seal_event_photo_once()');
    });
  },
};
