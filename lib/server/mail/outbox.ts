import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { OutgoingMail } from './send';

// Mail that reports something stored is written to the outbox in the same transaction as what it
// reports: a record that rolls back sends nothing, and one that commits cannot lose its mail. The
// worker in each app server sends it after the answer (./outbox-worker.ts).

/** A message for the outbox; kind says what wrote it (inspection_result, declaration_change, ...). */
export type QueuedMail = OutgoingMail & { kind: string };

/**
 * The insert as a statement of its own or a data-modifying CTE inside a caller's statement (one round
 * trip fewer on a hot path): it reads its rows from the JSON text in the named replacement.
 */
export function outboxInsertSql(param: string) {
  return `insert into mail_outbox (kind, to_address, subject, text_body, html_body)
          select m.kind, m.to, m.subject, m.text, m.html
            from json_to_recordset(:${param}::json) as m(kind text, "to" text, subject text, text text, html text)`;
}

/** The replacement outboxInsertSql reads. */
export function outboxRows(mails: QueuedMail[]): string {
  return JSON.stringify(
    mails.map((m) => ({ kind: m.kind, to: m.to, subject: m.subject, text: m.text, html: m.html ?? null })),
  );
}

/** Queues messages in one statement, inside the caller's transaction when given. */
export async function enqueueMail(mails: QueuedMail | QueuedMail[], transaction?: Transaction) {
  const list = Array.isArray(mails) ? mails : [mails];
  if (!list.length) return;
  await getDb().sequelize.query(outboxInsertSql('outboxMail'), {
    replacements: { outboxMail: outboxRows(list) },
    ...(transaction ? { transaction } : {}),
  });
}
