import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { serverEnv } from '@/lib/server/config/env';
import { logger } from '@/lib/server/observability';
import { requestsInFlight } from '@/lib/server/http/in-flight';
import { createBusyGate, type BusyGate } from '@/lib/core/concurrency/busy-gate';
import { sendMail } from './send';
import { queueSlotReminders } from '@/lib/server/schedule/queue-slot-reminders';

// Sends what lib/server/mail/outbox.ts queued. Each app server runs one worker (started by
// instrumentation.ts); no route starts or drives it. A batch is claimed with FOR UPDATE SKIP LOCKED
// inside a transaction held while it is sent, so two workers never hold the same row, and a row
// another worker has just sent is skipped once its sent_at commits. A failed send stays with its
// error and is tried again after a wait that doubles (MAIL_RETRY_BASE_MS, at most an hour); after
// MAX_ATTEMPTS it is marked failed and kept. A server that dies mid-batch leaves its rows unsent (the
// transaction rolls back), so a message may be sent twice only if the relay accepted it in the
// moment before the process died: at least once, never lost.

const BATCH = 50;
const MAX_ATTEMPTS = 10;
/** One tick stops taking new batches after this long, so a backlog never starves other work. */
const TICK_BUDGET_MS = 5_000;

type Row = { id: string; to: string; subject: string; text: string; html: string | null; attempts: number };

/** Sends one batch of due messages; returns how many were sent and how many failed. */
export async function sendOutboxBatch(limit = BATCH): Promise<{ claimed: number; sent: number; failed: number }> {
  const { sequelize } = getDb();
  const retryBaseMs = serverEnv().MAIL_RETRY_BASE_MS;
  return sequelize.transaction(async (transaction) => {
    const rows = await sequelize.query<Row>(
      `select id, to_address as "to", subject, text_body as text, html_body as html, attempts
         from mail_outbox
        where sent_at is null and failed_at is null and next_attempt_at <= now()
        order by next_attempt_at
        limit :limit
          for update skip locked`,
      { replacements: { limit }, type: QueryTypes.SELECT, transaction },
    );
    if (!rows.length) return { claimed: 0, sent: 0, failed: 0 };
    const results = await Promise.allSettled(
      rows.map((r) => sendMail({ to: r.to, subject: r.subject, text: r.text, ...(r.html ? { html: r.html } : {}) })),
    );
    const sent = rows.filter((_, i) => results[i].status === 'fulfilled').map((r) => r.id);
    const failed = rows.flatMap((r, i) => {
      const res = results[i];
      // The relay's answer, cut short, kept on the row; never the message itself.
      return res.status === 'rejected'
        ? [{ id: r.id, error: String(res.reason?.message ?? res.reason).slice(0, 500), code: res.reason?.responseCode }]
        : [];
    });
    await sequelize.query(
      `with s as (update mail_outbox set sent_at = now(), attempts = attempts + 1, last_error = null
                   where id = any(array[:sent]::uuid[]))
       update mail_outbox o
          set attempts = o.attempts + 1, last_error = f.error,
              next_attempt_at = now() + least(:retryBaseMs * power(2, o.attempts), 3600000) * interval '1 millisecond',
              failed_at = case when o.attempts + 1 >= :maxAttempts then now() end
         from json_to_recordset(:failed::json) as f(id uuid, error text)
        where o.id = f.id`,
      {
        replacements: {
          sent: sent.length ? sent : [null],
          failed: JSON.stringify(failed.map(({ id, error }) => ({ id, error }))),
          retryBaseMs,
          maxAttempts: MAX_ATTEMPTS,
        },
        transaction,
      },
    );
    // The log gets the count and the relay's reply code only: a relay's text may name the recipient.
    if (failed.length)
      logger().warn(
        { failed: failed.length, responseCode: failed[0].code ?? null },
        'mail outbox: sends failed, retrying later',
      );
    return { claimed: rows.length, sent: sent.length, failed: failed.length };
  });
}

type WorkerState = { timer?: NodeJS.Timeout; running: boolean; lastErrorLogAt: number; busy: BusyGate };
const globalForOutbox = globalThis as unknown as { __borelineOutbox?: WorkerState };

/** Sends batches until the due messages are gone or the tick's budget is spent. */
async function tick(state: WorkerState) {
  if (state.running) return; // the previous tick is still sending
  // The server is answering requests (a dock recording, say): mail waits, for MAIL_BUSY_DEFER_MS at most, so
  // a burst of records is answered before their e-mails are composed and sent on the same CPU.
  if (state.busy.shouldWait(requestsInFlight(), Date.now())) return;
  state.running = true;
  const started = Date.now();
  try {
    // Reminders of scrutineering slots that are due are queued first, so they go out in this tick; a
    // failure there never holds back the mail already queued.
    await queueSlotReminders().catch((err) => {
      if (Date.now() - state.lastErrorLogAt > 60_000) {
        state.lastErrorLogAt = Date.now();
        logger().warn({ err }, 'slot reminders: could not queue, trying again');
      }
    });
    for (;;) {
      const { claimed } = await sendOutboxBatch();
      if (claimed < BATCH || Date.now() - started > TICK_BUDGET_MS) break;
    }
  } catch (err) {
    // The database is down or restarting: the rows wait; say so at most once a minute.
    if (Date.now() - state.lastErrorLogAt > 60_000) {
      state.lastErrorLogAt = Date.now();
      logger().warn({ err }, 'mail outbox: could not read the outbox, trying again');
    }
  } finally {
    state.running = false;
  }
}

/** Starts this process's worker (once; later calls do nothing). It never keeps the process alive. */
export function startOutboxWorker() {
  if (globalForOutbox.__borelineOutbox) return;
  const state: WorkerState = {
    running: false,
    lastErrorLogAt: 0,
    busy: createBusyGate(() => serverEnv().MAIL_BUSY_DEFER_MS),
  };
  globalForOutbox.__borelineOutbox = state;
  state.timer = setInterval(() => void tick(state), serverEnv().MAIL_OUTBOX_INTERVAL_MS);
  state.timer.unref();
}
