import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { enqueueMail, type QueuedMail } from '@/lib/server/mail/outbox';
import { appUrl } from '@/lib/server/config/env';

/**
 * E-mails both parties of a protest (the protester and, once lodged, the protested entrant) with a
 * link to the protest page; stewards too when asked. Queued in the mail outbox after the change is
 * committed (the outbox worker sends it; the steward's request never waits for SMTP); a failure is
 * logged and never undoes the change.
 */
export async function notifyParties(
  protestId: string,
  subject: string,
  lines: string[],
  opts: { includeProtested?: boolean; includeStewards?: boolean } = {},
) {
  try {
    const [p] = await getDb().sequelize.query<{
      eventId: string;
      eventName: string;
      lodgerEmail: string;
      protestedEmail: string | null;
      boatName: string | null;
      raceNumber: number | null;
    }>(
      `select p.event_id as "eventId", ev.name as "eventName", lu.email as "lodgerEmail", pu.email as "protestedEmail",
              b.name as "boatName", e.race_number as "raceNumber"
         from protests p join events ev on ev.id = p.event_id join users lu on lu.id = p.lodged_by_id
         left join entries e on e.id = p.against_entry_id left join users pu on pu.id = e.entrant_id
         left join boats b on b.id = e.boat_id
        where p.id = :protestId`,
      { replacements: { protestId }, type: QueryTypes.SELECT },
    );
    if (!p) return;
    // Both parties read which boat the protest is about; the protested entrant may race several.
    const boat = p.boatName ? `No. ${p.raceNumber} ${p.boatName}` : null;
    const text = (opening: string[]) =>
      [
        ...opening,
        ...lines,
        '',
        `The protest: ${appUrl()}/protests/${protestId}`,
        '',
        "The governing body's rules, local regulations and licensed officials decide; every decision has a route to appeal.",
      ].join('\n');
    const mails: QueuedMail[] = [];
    const sent = new Set<string>();
    if (opts.includeProtested !== false && p.protestedEmail && boat) {
      sent.add(p.protestedEmail);
      mails.push({
        kind: 'protest',
        to: p.protestedEmail,
        subject: `${subject}: your boat ${boat} — ${p.eventName}`,
        text: text([`This protest is against your boat ${boat} at ${p.eventName}.`, '']),
      });
    }
    if (!sent.has(p.lodgerEmail)) {
      mails.push({
        kind: 'protest',
        to: p.lodgerEmail,
        subject: `${subject}${boat ? `: ${boat}` : ''} — ${p.eventName}`,
        text: text(boat ? [`The protested boat: ${boat}.`, ''] : []),
      });
    }
    if (opts.includeStewards) {
      const stewards = await getDb().sequelize.query<{ email: string }>(
        `select distinct u.email from event_staff s join users u on u.id = s.user_id where s.event_id = :eventId and s.role = 'steward'`,
        { replacements: { eventId: p.eventId }, type: QueryTypes.SELECT },
      );
      const stewardText = [
        ...(boat ? [`The protested boat: ${boat}.`, ''] : []),
        ...lines,
        '',
        `The stewards' page: ${appUrl()}/stewards/${p.eventId}/protests/${protestId}`,
      ].join('\n');
      for (const s of stewards)
        mails.push({
          kind: 'protest',
          to: s.email,
          subject: `Stewards: ${subject}${boat ? `: ${boat}` : ''} — ${p.eventName}`,
          text: stewardText,
        });
    }
    await enqueueMail(mails);
  } catch (err) {
    console.error('[boreline] protest e-mail not sent', protestId, subject, err);
  }
}
