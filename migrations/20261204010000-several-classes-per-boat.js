'use strict';
// Several classes per boat where the meeting allows it (issue 21, item 6). A meeting says so with
// events.several_classes_per_boat (off by default: one class per boat, as before). A boat keeps one race
// number at a meeting whatever classes it is in, and a number belongs to one boat there; those two rules
// cross rows of entries, so a trigger keeps them, taking the meeting's advisory lock so two entries saved
// at once are judged one after the other. The unique indexes stay the last guard within a class.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.query(`
      alter table events add column several_classes_per_boat boolean not null default false;

      drop index if exists entries_one_live_per_boat;
      create unique index entries_one_live_per_boat_class on entries (event_id, boat_id, class_id)
        where status in ('awaiting_payment', 'entered');
      drop index if exists entries_event_id_race_number;
      create unique index entries_one_live_number_per_class on entries (event_id, class_id, race_number)
        where status in ('awaiting_payment', 'entered');
      create index entries_event_boat on entries (event_id, boat_id);

      create function entries_keep_boat_numbers() returns trigger language plpgsql as $$
      declare
        several boolean;
      begin
        perform pg_advisory_xact_lock(hashtextextended('entries:' || new.event_id::text, 0));
        if exists (select 1 from entries e
                    where e.event_id = new.event_id and e.race_number = new.race_number
                      and e.boat_id <> new.boat_id and e.id <> new.id) then
          raise exception 'race number % is another boat''s at this meeting', new.race_number
            using errcode = 'unique_violation', constraint = 'entries_number_one_boat';
        end if;
        if new.status in ('awaiting_payment', 'entered') then
          if exists (select 1 from entries e
                      where e.event_id = new.event_id and e.boat_id = new.boat_id and e.id <> new.id
                        and e.status in ('awaiting_payment', 'entered') and e.race_number <> new.race_number) then
            raise exception 'a boat keeps one race number at a meeting'
              using errcode = 'unique_violation', constraint = 'entries_boat_one_number';
          end if;
          select several_classes_per_boat into several from events where id = new.event_id;
          if not several and exists (select 1 from entries e
                      where e.event_id = new.event_id and e.boat_id = new.boat_id and e.id <> new.id
                        and e.class_id <> new.class_id and e.status in ('awaiting_payment', 'entered')) then
            raise exception 'this meeting takes one class per boat'
              using errcode = 'unique_violation', constraint = 'entries_one_class_per_boat';
          end if;
        end if;
        return new;
      end $$;
      create trigger entries_keep_boat_numbers before insert or update of race_number, boat_id, class_id, status, event_id
        on entries for each row execute function entries_keep_boat_numbers();`);
  },
  async down(queryInterface) {
    await queryInterface.sequelize.query(`
      drop trigger if exists entries_keep_boat_numbers on entries;
      drop function if exists entries_keep_boat_numbers();
      drop index if exists entries_event_boat;
      drop index if exists entries_one_live_number_per_class;
      create unique index entries_event_id_race_number on entries (event_id, race_number);
      drop index if exists entries_one_live_per_boat_class;
      create unique index entries_one_live_per_boat on entries (event_id, boat_id)
        where status in ('awaiting_payment', 'entered');
      alter table events drop column several_classes_per_boat;`);
  },
};
