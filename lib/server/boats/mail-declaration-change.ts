import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { sendMail } from '@/lib/server/mail/send';

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
 * Tells each meeting's chief scrutineers that an inspected boat's declaration changed (sent after the
 * answer). Once per task: an owner editing again and again before the re-inspection does not flood
 * their inbox (the board shows the latest change).
 */
export async function mailChiefScrutineers(boatName: string, flagged: FlaggedEntry[]) {
  for (const f of flagged.filter((x) => x.opened)) {
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
