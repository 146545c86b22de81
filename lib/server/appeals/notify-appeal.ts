import 'server-only';
import type { Transaction } from 'sequelize';
import { enqueueMail } from '@/lib/server/mail/outbox';
import { appUrl } from '@/lib/server/config/env';
import { GOVERNING_BODY_CAUTION } from '../../core/penalties/penalty-kinds';
import { appealPartyAddresses, type AppealRecord } from './appeal-view';

/** Queues one message about an appeal to its parties (or the appellant alone), in the caller's transaction. */
export async function notifyAppeal(
  a: AppealRecord,
  subject: string,
  lines: string[],
  transaction: Transaction,
  opts: { appellantOnly?: boolean } = {},
) {
  const to = opts.appellantOnly ? [a.lodgedByEmail] : await appealPartyAddresses(a, transaction);
  await enqueueMail(
    to.map((address) => ({
      kind: 'appeal',
      to: address,
      subject: `${subject}: appeal on #${a.raceNumber} ${a.boatName} (${a.eventName})`.slice(0, 200),
      text: [
        ...lines,
        '',
        `Penalty appealed: ${a.penaltyCode} ${a.penaltyLabel}`,
        `The appeal: ${appUrl()}/appeals/${a.id}`,
        '',
        GOVERNING_BODY_CAUTION,
      ].join('\n'),
    })),
    transaction,
  );
}
