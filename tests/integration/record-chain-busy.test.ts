// Runs alone (scripts/test.sh): it times the record chain's linker against the server being busy, which
// requests from another test file would move.
// The record chain's linker (lib/server/chain/chain-worker.ts) holds back while the app server is answering
// requests, for CHAIN_BUSY_DEFER_MS at most (the suite sets 1 s), then links anyway; a record made while a
// request is held open is linked only after that bound, and then within a couple of the linker's ticks.
// No published source: holding back deferrable work while a server is busy is common practice.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { setTimeout as sleep } from 'node:timers/promises';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { holdRequestOpen } from '../support/held-request';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const scrutineer = new HttpSession();

before(async () => {
  await meeting.create(`Busy Chain Meeting ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});

const queued = async (id: string) =>
  (
    await query<{ n: number }>(
      `select count(*)::int as n from chain_queue where table_name = 'inspections' and row_id = $1`,
      [id],
    )
  )[0].n;

test('while the server is answering a request, a new record waits to be linked, at most CHAIN_BUSY_DEFER_MS', async () => {
  const deferMs = Number(process.env.CHAIN_BUSY_DEFER_MS);
  const tickMs = Number(process.env.CHAIN_LINK_INTERVAL_MS ?? 2000);
  assert.ok(deferMs > 0 && deferMs <= 5000, 'the suite sets a short CHAIN_BUSY_DEFER_MS');
  const entry = await meeting.addEntry(await meeting.addClass('CB', rulesWith()));
  await sleep(tickMs + 500); // one idle tick at least: the linker's busy clock starts afresh
  // A sign-up whose chunked body never ends stays in flight until this test finishes it.
  const held = holdRequestOpen();
  const { heldAt } = held;
  let answered: Promise<number> | undefined;
  try {
    const { res, body } = await scrutineer.json(
      `/api/events/${meeting.eventId}/inspections`,
      inspectionBody(entry.id, 101.5),
    );
    assert.equal(res.status, 201, JSON.stringify(body));
    const id = body.data.id as string;
    assert.equal(await queued(id), 1, 'the record is queued for linking when it is answered');
    const deadline = heldAt + deferMs + 2 * tickMs + 3000;
    while ((await queued(id)) === 1) {
      assert.ok(Date.now() < deadline, `not linked ${Date.now() - heldAt} ms after the server became busy`);
      await sleep(50);
    }
    const linkedAfterMs = Date.now() - heldAt;
    assert.ok(
      linkedAfterMs >= deferMs,
      `linked ${linkedAfterMs} ms after the server became busy: it did not hold back`,
    );
    const links = await query(`select 1 from chain_links where table_name = 'inspections' and row_id = $1`, [id]);
    assert.equal(links.length, 1, 'then linked once');
  } finally {
    answered = held.finish();
  }
  assert.equal(await answered, 400, 'the held sign-up, finished without its fields, is refused (and loses nothing)');
});
