'use strict';
// Scrutineering slots and the dock queue (issue 21, item 3), and incidents (item 5).
// - inspection_slots: a time at a bay for one class, with a capacity, opened by the chief scrutineer.
// - slot_bookings: append-only; a re-booking is a new row that supersedes the entry's current one
//   (one booking chain per entry and meeting; the current booking is the row nothing supersedes).
// - slot_arrivals: append-only check-ins at the dock, with the phone's key (a retry stores nothing new);
//   a walk-in has no booking.
// - slot_reminders: one row per booking whose reminder was queued (the unique key makes it once only).
// - incidents: append-only; a correction is a new row that supersedes; damage opens a re-inspection task
//   (reinspection_id) in the same transaction. incident_photos: append-only, bytes in object storage.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const { UUID, STRING, DATE, DATEONLY, INTEGER, TEXT, BOOLEAN, BIGINT } = Sequelize;
    const id = { type: UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
    const ref = (table, allowNull = false) => ({ type: UUID, allowNull, references: { model: table, key: 'id' }, onDelete: 'RESTRICT' });
    const now = { type: DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
    await queryInterface.sequelize.transaction(async (transaction) => {
      const q = (sql) => queryInterface.sequelize.query(sql, { transaction });
      await queryInterface.createTable(
        'inspection_slots',
        {
          id,
          event_id: ref('events'),
          class_id: ref('race_classes'),
          bay: { type: STRING(40), allowNull: false },
          starts_at: { type: DATE, allowNull: false },
          ends_at: { type: DATE, allowNull: false },
          capacity: { type: INTEGER, allowNull: false },
          grace_minutes: { type: INTEGER, allowNull: false, defaultValue: 10 },
          created_by_id: ref('users'),
          created_at: now,
        },
        { transaction },
      );
      await q(`alter table inspection_slots
        add constraint inspection_slots_capacity_check check (capacity between 1 and 50),
        add constraint inspection_slots_grace_check check (grace_minutes between 0 and 120),
        add constraint inspection_slots_times_check check (ends_at > starts_at and ends_at - starts_at <= interval '12 hours')`);
      await q(`create index inspection_slots_event_starts on inspection_slots (event_id, starts_at)`);

      await queryInterface.createTable(
        'slot_bookings',
        {
          id,
          event_id: ref('events'),
          slot_id: ref('inspection_slots'),
          entry_id: ref('entries'),
          booked_by_id: ref('users'),
          supersedes_id: ref('slot_bookings', true),
          created_at: now,
        },
        { transaction },
      );
      // One chain per entry: one first booking, each booking superseded at most once.
      await q(`create unique index slot_bookings_first on slot_bookings (event_id, entry_id) where supersedes_id is null`);
      await q(`create unique index slot_bookings_supersedes on slot_bookings (supersedes_id) where supersedes_id is not null`);
      await q(`create index slot_bookings_slot on slot_bookings (slot_id)`);
      await q(`create trigger slot_bookings_append_only before update or delete on slot_bookings
        for each row execute function boreline_append_only();`);

      await queryInterface.createTable(
        'slot_arrivals',
        {
          id,
          event_id: ref('events'),
          entry_id: ref('entries'),
          booking_id: ref('slot_bookings', true),
          client_key: { type: UUID, allowNull: false },
          meeting_day: { type: DATEONLY, allowNull: false },
          bay: { type: STRING(40), allowNull: false, defaultValue: '' },
          arrived_at: { type: DATE, allowNull: false },
          recorded_by_id: ref('users'),
          created_at: now,
        },
        { transaction },
      );
      await q(`create unique index slot_arrivals_key on slot_arrivals (event_id, client_key)`);
      // A booking is checked in once; a walk-in once per entry and meeting day.
      await q(`create unique index slot_arrivals_booking on slot_arrivals (booking_id) where booking_id is not null`);
      await q(`create unique index slot_arrivals_walk_in on slot_arrivals (event_id, entry_id, meeting_day) where booking_id is null`);
      await q(`create trigger slot_arrivals_append_only before update or delete on slot_arrivals
        for each row execute function boreline_append_only();`);

      await queryInterface.createTable(
        'slot_reminders',
        { booking_id: { ...ref('slot_bookings'), primaryKey: true }, queued_at: now },
        { transaction },
      );
      await q(`create trigger slot_reminders_append_only before update or delete on slot_reminders
        for each row execute function boreline_append_only();`);

      await queryInterface.createTable(
        'incidents',
        {
          id,
          event_id: ref('events'),
          entry_id: ref('entries'),
          occurred_at: { type: DATE, allowNull: false },
          description: { type: TEXT, allowNull: false },
          damage: { type: BOOLEAN, allowNull: false },
          reinspection_id: ref('reinspections', true),
          supersedes_id: ref('incidents', true),
          correction_reason: { type: TEXT },
          recorded_by_id: ref('users'),
          created_at: now,
        },
        { transaction },
      );
      await q(`alter table incidents
        add constraint incidents_description_check check (length(description) between 3 and 4000),
        add constraint incidents_correction_check check ((supersedes_id is null) = (correction_reason is null)),
        add constraint incidents_damage_task_check check (not damage or reinspection_id is not null)`);
      await q(`create unique index incidents_supersedes on incidents (supersedes_id) where supersedes_id is not null`);
      await q(`create index incidents_event on incidents (event_id, occurred_at)`);
      await q(`create index incidents_entry on incidents (entry_id)`);
      await q(`create trigger incidents_append_only before update or delete on incidents
        for each row execute function boreline_append_only();`);

      await queryInterface.createTable(
        'incident_photos',
        {
          id,
          incident_id: ref('incidents'),
          object_key: { type: STRING, allowNull: false, unique: true },
          content_type: { type: STRING, allowNull: false },
          size_bytes: { type: BIGINT, allowNull: false },
          sha256: { type: STRING(64), allowNull: false },
          uploaded_by_id: ref('users'),
          created_at: now,
        },
        { transaction },
      );
      await q(`create unique index incident_photos_sha on incident_photos (incident_id, sha256)`);
      await q(`create trigger incident_photos_append_only before update or delete on incident_photos
        for each row execute function boreline_append_only();`);
    });
  },
  async down(queryInterface) {
    for (const t of ['incident_photos', 'incidents', 'slot_reminders', 'slot_arrivals', 'slot_bookings', 'inspection_slots'])
      await queryInterface.dropTable(t);
  },
};
