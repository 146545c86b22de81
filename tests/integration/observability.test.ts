// Issue 17, item 6: structured JSON logs with a request id on every request line and in the error
// answer; metrics in the Prometheus text exposition format (Prometheus documentation, "Exposition
// formats", text format 0.0.4) for the site administrator; liveness and readiness kept apart.
// Runs alone (scripts/test.sh): it reads the app's metrics counters, which every recorded inspection moves.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { HttpSession } from '../support/http-session';
import { BASE_URL, DEMO, DEMO_PASSWORD } from '../support/env';
import { InspectionMeeting, inspectionBody, rulesWith } from '../support/inspection-meeting';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
const admin = new HttpSession();

before(async () => {
  await admin.signInWithPassword(DEMO.admin, DEMO_PASSWORD);
});

type LogLine = {
  level: number;
  msg: string;
  requestId?: string;
  method?: string;
  path?: string;
  status?: number;
  ms?: number;
  time: string;
};

/** The app server's log lines (scripts/test.sh keeps it in BORELINE_APP_LOG), parsed; waits for one to match. */
async function findLogLine(match: (l: LogLine) => boolean): Promise<LogLine> {
  const file = process.env.BORELINE_APP_LOG;
  assert.ok(file, 'scripts/test.sh names the app log');
  for (let i = 0; i < 50; i++) {
    const lines = readFileSync(file, 'utf8')
      .split('\n')
      .filter((l) => l.startsWith('{'));
    const found = lines.map((l) => JSON.parse(l) as LogLine).find(match);
    if (found) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('no matching log line');
}

async function scrape(): Promise<string> {
  const res = await admin.fetch('/api/metrics');
  assert.equal(res.status, 200);
  assert.match(res.headers.get('content-type') ?? '', /^text\/plain; version=0\.0\.4/);
  return res.text();
}

/** The value of one sample line of a scrape (0 when the series is not there yet). */
function sample(text: string, name: string, labels: string): number {
  const line = text.split('\n').find((l) => l.startsWith(`${name}{${labels}}`) || l.startsWith(`${name}{${labels},`));
  return line ? Number(line.split(' ').at(-1)) : 0;
}

test('every answer carries a request id, and the JSON log has a line for the request with it', async () => {
  const res = await fetch(`${BASE_URL}/api/health/live`);
  assert.equal(res.status, 200);
  const id = res.headers.get('x-request-id') ?? '';
  assert.match(id, UUID);
  const line = await findLogLine((l) => l.requestId === id);
  assert.equal(line.msg, 'request');
  assert.equal(line.method, 'GET');
  assert.equal(line.path, '/api/health/live');
  assert.equal(line.status, 200);
  assert.ok(typeof line.ms === 'number' && line.ms >= 0);
  assert.ok(!Number.isNaN(Date.parse(line.time)), 'ISO time on the line');
});

test("a client's own X-Request-Id is not taken when no proxy is declared (it could forge another's)", async () => {
  const res = await fetch(`${BASE_URL}/api/health/live`, { headers: { 'x-request-id': 'forged-request-id-0001' } });
  assert.notEqual(res.headers.get('x-request-id'), 'forged-request-id-0001');
  assert.match(res.headers.get('x-request-id') ?? '', UUID);
});

test('an error answer names the request id, the same as its header and its log line', async () => {
  const res = await admin.fetch('/api/events', {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: '{not json',
  });
  assert.equal(res.status, 400);
  const body = (await res.json()) as { error: { code: string; requestId?: string } };
  assert.equal(body.error.code, 'invalid_json');
  assert.equal(body.error.requestId, res.headers.get('x-request-id'));
  const line = await findLogLine((l) => l.requestId === body.error.requestId);
  assert.equal(line.status, 400);
});

test('liveness answers without the database; readiness is the database check', async () => {
  const live = await fetch(`${BASE_URL}/api/health/live`);
  assert.equal(live.status, 200);
  assert.equal(((await live.json()) as { data: { status: string } }).data.status, 'ok');
  const ready = await fetch(`${BASE_URL}/api/health/ready`);
  assert.equal(ready.status, 200);
  assert.equal(((await ready.json()) as { data: { database: string } }).data.database, 'up');
});

test('metrics: request latency by route, pool use and recording outcomes, for the site administrator only', async () => {
  assert.equal((await fetch(`${BASE_URL}/api/metrics`)).status, 401);
  const entrant = new HttpSession();
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  assert.equal((await entrant.fetch('/api/metrics')).status, 403);

  const before = await scrape();
  const meeting = await new InspectionMeeting().create(`Metrics ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  const classId = await meeting.addClass('MX', rulesWith());
  const entry = await meeting.addEntry(classId);
  const scrutineer = new HttpSession();
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  const body = inspectionBody(entry.id, 101.9);
  assert.equal((await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, body)).res.status, 201);
  assert.equal((await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, body)).res.status, 200);
  const refused = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, { ...body, idempotencyKey: 'x' });
  assert.equal(refused.res.status, 400);
  await fetch(`${BASE_URL}/api/health/live`);

  const after = await scrape();
  const records = 'boreline_inspection_records_total';
  assert.equal(sample(after, records, 'outcome="created"') - sample(before, records, 'outcome="created"'), 1);
  assert.equal(sample(after, records, 'outcome="replayed"') - sample(before, records, 'outcome="replayed"'), 1);
  assert.equal(sample(after, records, 'outcome="refused"') - sample(before, records, 'outcome="refused"'), 1);
  // A histogram per route (ids replaced by :id), with its buckets, sum and count.
  assert.match(after, /# TYPE boreline_http_request_duration_seconds histogram/);
  assert.match(
    after,
    /boreline_http_request_duration_seconds_bucket\{le="0\.1",method="GET",route="\/api\/health\/live",status="2xx"\} \d+/,
  );
  assert.match(
    after,
    /boreline_http_request_duration_seconds_count\{method="POST",route="\/api\/events\/:id\/inspections",status="2xx"\} \d+/,
  );
  assert.doesNotMatch(after, new RegExp(meeting.eventId), 'no id becomes a label');
  assert.match(after, /boreline_db_pool_connections\{state="in_use"\} \d+/);
  assert.match(after, /boreline_db_pool_connections\{state="waiting"\} \d+/);
});

test('metrics labels stay few: unknown paths and typed serials are "unmatched" or their route, never the raw path', async () => {
  // Prometheus, "Instrumentation": do not use labels with unbounded values. Found by an outside test:
  // every distinct 404 path used to become a series kept for ever.
  const junk = `/zz${Date.now()}x${Math.floor(Math.random() * 1e6)}`;
  // Each answer read to its end: a request is counted when its answer has finished, not at its headers.
  const notFound = await fetch(`${BASE_URL}${junk}`);
  assert.equal(notFound.status, 404);
  await notFound.text();
  await (await fetch(`${BASE_URL}/api/events/not-a-meeting/component-serials/TM-${Date.now()}`)).text();
  const after = await scrape();
  assert.ok(!after.includes(junk), 'the junk path is not a label');
  assert.doesNotMatch(after, /component-serials\/TM-/, 'no serial becomes a label');
  assert.match(after, /route="unmatched"/);
  assert.match(after, /route="\/api\/events\/:id\/component-serials\/:id"/);
});
