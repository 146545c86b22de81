'use strict';
// Issue 15, item 6 (seals): the free-text seals that inspections recorded before the register
// (inspections.measurements->'seals', entries { number, location }) become register entries where
// they can be read, and officials' notes on the boat where they cannot. Nothing is removed: the
// inspection keeps its free-text list as written (inspections are append-only).
//
// Read as a seal: a plausible number (letters, digits and dashes, 1 to 40 characters). The first time a
// number is seen it becomes a seal with no batch (carried over) and an 'applied' event at that
// inspection, its position the free-text location; the same number on the same boat at a later
// inspection is an 'intact' event. The same number on another boat, a number the register already
// holds for something else, a repeat within one record, or anything else is kept as a note
// (boat_log_notes, 'observation', by the inspection's recorder, at that meeting, dated the day of the
// inspection in the meeting's time zone) naming the inspection and the text. Times are the capture time.

const PLAUSIBLE = /^[A-Za-z0-9-]{1,40}$/;

const cut = (s, n) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);

/**
 * Carries the free-text seals of inspections that have not been carried yet (no seal event and no
 * note names them), oldest capture first. Exported so a test can run it on rows of its own
 * (inspectionIds); returns what it wrote.
 */
async function carryFreeTextSeals(sequelize, { transaction, inspectionIds } = {}) {
  const q = (sql, replacements = {}) => sequelize.query(sql, { replacements, transaction });
  const [rows] = await q(
    `select i.id, i.boat_id as "boatId", i.event_id as "eventId", i.recorded_by_id as "recordedById",
            i.measurements->'seals' as seals
       from inspections i
      where jsonb_typeof(i.measurements->'seals') = 'array' and jsonb_array_length(i.measurements->'seals') > 0
        and not exists (select 1 from seal_events e where e.inspection_id = i.id)
        and not exists (select 1 from boat_log_notes n where n.boat_id = i.boat_id and n.body like '%' || i.id::text || '%')
        ${inspectionIds ? 'and i.id in (:inspectionIds)' : ''}
      order by i.captured_at, i.id`,
    { inspectionIds: inspectionIds ?? [] },
  );
  const out = { seals: 0, events: 0, notes: 0 };
  for (const i of rows) {
    const seen = new Set();
    for (const entry of i.seals) {
      const number = entry && typeof entry.number === 'string' ? entry.number.trim() : null;
      const location = entry && typeof entry.location === 'string' ? entry.location.trim() : '';
      let why = null;
      if (!number || !PLAUSIBLE.test(number)) why = 'not a plausible seal number';
      else if (seen.has(number.toUpperCase())) why = 'the same number twice in one record';
      if (!why) {
        seen.add(number.toUpperCase());
        const [[seal]] = await q(
          `select s.id, s.batch_id as "batchId",
                  (select e.boat_id from seal_events e where e.seal_id = s.id order by e.created_at desc, e.id desc limit 1) as "lastBoatId",
                  (select e.action from seal_events e where e.seal_id = s.id order by e.created_at desc, e.id desc limit 1) as "lastAction"
             from seals s where upper(s.number) = upper(:number)`,
          { number },
        );
        let sealId = null;
        let action = null;
        if (!seal) {
          const [[created]] = await q(
            `insert into seals (batch_id, number, created_at)
             select null, :number, captured_at from inspections where id = :inspectionId returning id`,
            { number: number.toUpperCase(), inspectionId: i.id },
          );
          out.seals++;
          sealId = created.id;
          action = 'applied';
        } else if (seal.batchId === null && seal.lastBoatId === i.boatId && seal.lastAction !== 'removed') {
          sealId = seal.id;
          action = 'intact';
        } else if (seal.batchId === null && seal.lastBoatId && seal.lastBoatId !== i.boatId) {
          why = 'the same number was recorded on another boat';
        } else {
          why = 'the number is already in the register for another seal';
        }
        if (sealId) {
          await q(
            `insert into seal_events (seal_id, action, boat_id, event_id, inspection_id, position, recorded_by_id, created_at)
             select :sealId, :action, :boatId, :eventId, id, :position, :recordedById, captured_at from inspections where id = :inspectionId`,
            {
              sealId,
              action,
              boatId: i.boatId,
              eventId: i.eventId,
              inspectionId: i.id,
              position: cut(location, 200),
              recordedById: i.recordedById,
            },
          );
          out.events++;
          continue;
        }
      }
      const text = entry && typeof entry === 'object' ? `number “${String(entry.number ?? '')}”, location “${String(entry.location ?? '')}”` : JSON.stringify(entry);
      await q(
        `insert into boat_log_notes (boat_id, event_id, category, body, noted_on, author_id, created_at)
         select :boatId, :eventId, 'observation', :body, (i.captured_at at time zone ev.time_zone)::date, :authorId, i.captured_at
           from inspections i join events ev on ev.id = i.event_id where i.id = :inspectionId`,
        {
          boatId: i.boatId,
          eventId: i.eventId,
          body: cut(
            `A seal written as free text at inspection ${i.id} could not be carried into the seal register (${why}): ${cut(text, 3000)}.`,
            4000,
          ),
          inspectionId: i.id,
          authorId: i.recordedById,
        },
      );
      out.notes++;
    }
  }
  return out;
}

/** @type {import('sequelize-cli').Migration} */
const migration = {
  async up(queryInterface) {
    await queryInterface.sequelize.transaction(async (transaction) => {
      await carryFreeTextSeals(queryInterface.sequelize, { transaction });
    });
  },
  async down() {
    // Seals, seal events and notes are append-only (triggers): what was carried over stays.
  },
};

module.exports = { ...migration, carryFreeTextSeals };
