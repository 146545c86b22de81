// Issue 18, item 4: mail leaves through an outbox table that each app server's worker drains
// (lib/server/mail/outbox.ts, outbox-worker.ts), so the dock never waits for SMTP. What must hold:
// a mail queued by a record whose transaction rolls back is never sent; a send the relay refuses
// stays queued and is sent later; two app servers' workers never send one message twice.
// SMTP reply 451 is a transient failure that a client retries (RFC 5321, section 4.2.3 and 4.5.4.1).
// And the worker holds back while the server is answering requests, for MAIL_BUSY_DEFER_MS at most.
// Runs alone (scripts/test.sh): it starts a second app server, puts a trigger on inspections and watches the outbox
// workers.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, MAIL_INBOX, uniqueEmail } from '../support/env';
import { holdRequestOpen } from '../support/held-request';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';
import { waitForMail, type Mail } from '../support/mail';
import { startAppServer, stopAll } from '../../scripts/app-servers';

after(stopAll);

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const FAKE = new URL(MAIL_INBOX).origin;

async function inbox(to: string): Promise<(Mail & { from: string })[]> {
  const res = await fetch(`${MAIL_INBOX}?to=${encodeURIComponent(to)}`);
  return ((await res.json()) as { data: (Mail & { from: string })[] }).data;
}

/** Polls until check() returns something truthy, or fails naming what it waited for. */
async function waitUntil<T>(what: string, check: () => Promise<T>, timeoutMs = 20_000): Promise<NonNullable<T>> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await check();
    if (v) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await sleep(150);
  }
}

let scrutineer: HttpSession;
let meeting: InspectionMeeting;
let entry: TestEntry;
let ownerEmail: string;

before(async () => {
  meeting = await new InspectionMeeting().create(`Outbox meeting ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  const classId = await meeting.addClass('OBX', rulesWith());
  // The boat's owner has an address of their own, so every result mail to it belongs to this file.
  ownerEmail = uniqueEmail('outbox-owner');
  await query(`insert into users (email, name, email_verified) values ($1, 'Outbox Owner', now())`, [ownerEmail]);
  entry = await meeting.addEntry(classId, { ownerEmail });
  scrutineer = new HttpSession();
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});

test('a record whose transaction rolls back at commit queues nothing and sends nothing', async () => {
  const device = `rollback-${randomBytes(4).toString('hex')}`;
  // A deferred trigger fails the record's transaction at COMMIT, after every statement of the record
  // (the result mail's enqueue included) has run: only this test's device name trips it.
  const fn = `outbox_test_fail_${randomBytes(4).toString('hex')}`;
  await query(`create function ${fn}() returns trigger language plpgsql as $$
                 begin raise exception 'refused at commit by the outbox test'; end $$`);
  await query(`create constraint trigger ${fn} after insert on inspections deferrable initially deferred
                 for each row when (new.device = '${device}') execute function ${fn}()`);
  let refusedKey: string;
  try {
    const body = inspectionBody(entry.id, 101.7, { device });
    refusedKey = body.idempotencyKey;
    const { res, body: answer } = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, body);
    assert.ok(res.status >= 500, `the failed commit is an error (${res.status}): ${JSON.stringify(answer)}`);
    assert.ok(answer.error?.code, 'in the one error shape');
  } finally {
    await query(`drop trigger ${fn} on inspections`);
    await query(`drop function ${fn}()`);
  }
  assert.deepEqual(await query('select id from inspections where idempotency_key = $1', [refusedKey]), []);
  assert.deepEqual(await query('select id from mail_outbox where to_address = $1', [ownerEmail]), [], 'nothing queued');

  // A later record of the same entry commits: its mail arrives, and it is the only one there ever was.
  const ok = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, inspectionBody(entry.id, 101.7));
  assert.equal(ok.res.status, 201, JSON.stringify(ok.body));
  await waitForMail(ownerEmail, { subject: /inspection result/ });
  const rows = await query<{ sent: boolean }>(
    'select sent_at is not null as sent from mail_outbox where to_address = $1',
    [ownerEmail],
  );
  assert.deepEqual(rows, [{ sent: true }], 'one row, sent');
  assert.equal((await inbox(ownerEmail)).length, 1, 'one message in the inbox');
});

test('a send the relay refuses is kept, retried after a wait, and sent once accepted', async () => {
  const to = uniqueEmail('outbox-retry');
  const refuse = await fetch(`${FAKE}/refuse?to=${encodeURIComponent(to)}&times=2`, { method: 'POST' });
  assert.equal(refuse.status, 200);
  const [row] = await query<{ id: string }>(
    `insert into mail_outbox (kind, to_address, subject, text_body) values ('test', $1, 'retry me', 'body') returning id`,
    [to],
  );
  // The first refusal is stored with the relay's answer and a later time for the next try.
  const failed = await waitUntil('the first refusal to be stored', async () => {
    const [r] = await query<{ attempts: number; lastError: string | null; waitMs: number; sent: boolean }>(
      `select attempts, last_error as "lastError", extract(epoch from next_attempt_at - now()) * 1000 as "waitMs",
              sent_at is not null as sent
         from mail_outbox where id = $1`,
      [row.id],
    );
    return r.attempts >= 1 ? r : null;
  });
  assert.equal(failed.sent, false);
  assert.match(failed.lastError ?? '', /451/, 'the relay’s transient refusal is kept');
  const mail = await waitForMail(to, { timeoutMs: 20_000 });
  assert.equal(mail.subject, 'retry me');
  const [done] = await query<{ attempts: number; sent: boolean; failed: boolean }>(
    'select attempts, sent_at is not null as sent, failed_at is not null as failed from mail_outbox where id = $1',
    [row.id],
  );
  assert.deepEqual(done, { attempts: 3, sent: true, failed: false }, 'two refusals, then sent');
  assert.equal((await inbox(to)).length, 1, 'sent once');
});

test('two app servers drain one outbox without sending any message twice', async () => {
  // A second app server from the same build, whose envelope sender differs, so the inbox shows which
  // worker sent each message (port offset +24: no other script uses it).
  const second = await startAppServer(Number(process.env.PORT ?? 3100) + 24, {
    MAIL_FROM: 'Boreline second <no-reply-second@boreline.invalid>',
  });
  const to = uniqueEmail('outbox-twice');
  const n = 300;
  await query(
    `insert into mail_outbox (kind, to_address, subject, text_body)
     select 'test', $1, 'message ' || i, 'body ' || i from generate_series(1, $2::int) i`,
    [to, n],
  );
  await waitUntil(
    'every message to be sent',
    async () =>
      Number(
        (
          await query<{ n: string }>(
            'select count(*) as n from mail_outbox where to_address = $1 and sent_at is not null',
            [to],
          )
        )[0].n,
      ) === n,
    60_000,
  );
  const got = await inbox(to);
  const subjects = got.map((m) => m.subject);
  assert.equal(got.length, n, 'as many messages as rows');
  assert.equal(new Set(subjects).size, n, 'each message once');
  const attempts = await query<{ attempts: number; n: string }>(
    'select attempts, count(*) as n from mail_outbox where to_address = $1 group by attempts',
    [to],
  );
  assert.deepEqual(attempts, [{ attempts: 1, n: String(n) }], 'each row claimed and sent once');
  const senders = new Set(got.map((m) => m.from));
  assert.ok(
    senders.has('no-reply@boreline.invalid') && senders.has('no-reply-second@boreline.invalid'),
    `both workers took part: ${[...senders].join(', ')}`,
  );
  second.kill('SIGTERM');
});

test('while the server is answering a request, queued mail waits, at most MAIL_BUSY_DEFER_MS, then goes out', async () => {
  const deferMs = Number(process.env.MAIL_BUSY_DEFER_MS);
  assert.ok(deferMs > 0 && deferMs <= 5000, 'the suite sets a short MAIL_BUSY_DEFER_MS');
  await sleep(600); // idle ticks (every 200 ms in the suite): the worker's busy clock starts afresh
  // A sign-up whose chunked body never ends stays in flight until this test finishes it.
  const held = holdRequestOpen();
  const { heldAt } = held;
  let answered: Promise<number> | undefined;
  try {
    await sleep(300);
    const to = uniqueEmail('outbox-busy');
    await query(
      `insert into mail_outbox (kind, to_address, subject, text_body) values ('test', $1, 'after the rush', 'body')`,
      [to],
    );
    const mail = await waitForMail(to, { timeoutMs: deferMs + 10_000 });
    const waitedMs = Date.now() - heldAt;
    assert.equal(mail.subject, 'after the rush');
    assert.ok(waitedMs >= deferMs, `sent ${waitedMs} ms after the server became busy: it did not hold back`);
  } finally {
    answered = held.finish();
  }
  assert.equal(await answered, 400, 'the held sign-up, finished without its fields, is refused (and loses nothing)');
});
