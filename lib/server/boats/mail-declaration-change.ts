import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { sendMail } from '@/lib/server/mail/send';

export type FlaggedEntry = { entryId: string; eventId: string; raceNumber: number; eventName: string; changes: string };

/** Tells each meeting's chief scrutineers that an inspected boat's declaration changed (sent after the answer). */
export async function mailChiefScrutineers(boatName: string, flagged: FlaggedEntry[]) {
  for (const f of flagged) {
    try {
      const chiefs = await getDb().sequelize.query<{ email: string }>(
        `select distinct u.email from event_staff s join users u on u.id = s.user_id
          where s.event_id = :eventId and s.role = 'chief_scrutineer'`,
        { replacements: { eventId: f.eventId }, type: QueryTypes.SELECT },
      );
      for (const { email } of chiefs)
        await sendMail({
          to: email,
          subject: `${boatName} (no. ${f.raceNumber}): declaration changed after inspection, re-inspection required`,
          text: [
            `The owner of ${boatName} (no. ${f.raceNumber}) at ${f.eventName} changed the boat's declaration after it was inspected.`,
            `What changed: ${f.changes}.`,
            '',
            'The earlier verdict no longer counts for this entry, and the draft parity report leaves the boat out until it is inspected again. The entry is listed under re-inspections on the inspection board.',
            '',
            'Safety first: Boreline supports the checks; it never replaces them. The governing body’s rules, local regulations and the judgement of licensed officials decide every verdict and every safety matter.',
          ].join('\n'),
        });
    } catch (err) {
      // The change and the board's flag are stored whatever the mail relay does.
      console.error('[boreline] declaration change mail failed', err);
    }
  }
}
