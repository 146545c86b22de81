import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';

export type FlaggedEntry = {
  entryId: string;
  eventId: string;
  raceNumber: number;
  eventName: string;
  changes: string;
  /** True when this change opened the task; later edits before the re-inspection update it without another e-mail. */
  opened: boolean;
};

/**
 * Tells each meeting's chief scrutineers that an inspected boat's declaration changed: queued in the
 * mail outbox (inside the caller's transaction when given, so a change that rolls back tells nobody),
 * one statement for every flagged entry and chief. Once per task: an owner editing again and again
 * before the re-inspection does not flood their inbox (the board shows the latest change).
 */
export async function mailChiefScrutineers(boatName: string, flagged: FlaggedEntry[], transaction?: Transaction) {
  const mails = flagged
    .filter((x) => x.opened)
    .map((f) => ({
      eventId: f.eventId,
      subject: `${boatName} (no. ${f.raceNumber}): declaration changed after inspection, re-inspection required`,
      text: [
        `The owner of ${boatName} (no. ${f.raceNumber}) at ${f.eventName} changed the boat's declaration after it was inspected.`,
        `What changed: ${f.changes}.`,
        '',
        'The earlier verdict no longer counts for this entry, and the draft parity report leaves the boat out until it is inspected again. The entry is listed under re-inspections on the inspection board.',
        '',
        'Safety first: Boreline supports the checks; it never replaces them. The governing body’s rules, local regulations and the judgement of licensed officials decide every verdict and every safety matter.',
      ].join('\n'),
    }));
  if (!mails.length) return;
  // Addressed in the database to the meeting's chief scrutineers now: one message per address and entry.
  await getDb().sequelize.query(
    `insert into mail_outbox (kind, to_address, subject, text_body)
     select distinct 'declaration_change', u.email, m.subject, m.text
       from json_to_recordset(:mails::json) as m("eventId" uuid, subject text, text text)
       join event_staff s on s.event_id = m."eventId" and s.role = 'chief_scrutineer'
       join users u on u.id = s.user_id`,
    { replacements: { mails: JSON.stringify(mails) }, ...(transaction ? { transaction } : {}) },
  );
}
