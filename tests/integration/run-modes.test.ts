// How the app runs (scripts/server.mjs, as npm start and the tests start it): the demo on loopback
// only, the client address from the socket when no proxy is declared (a forged X-Forwarded-For buys
// no fresh quota: OWASP, "Denial of Service Cheat Sheet"), the outbox (everyone's sign-in links) for
// the site administrator alone and only in the demo, and no webhook signed with a secret anyone can
// read in this repository (OWASP, "Secrets Management Cheat Sheet").
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import os from 'node:os';
import { spawn, execFileSync, type ChildProcess } from 'node:child_process';
import Stripe from 'stripe';
import { BASE_URL, DEMO, DEMO_PASSWORD } from '../support/env';
import { HttpSession } from '../support/http-session';
import { query } from '../support/db';
import { fromAddress, randomLoopback } from '../support/from-address';
import { parseDotenv, PUBLISHED_SECRETS } from '../../lib/server/config/published-values';

const PORT = Number(process.env.PORT ?? 3100);
const example = parseDotenv(fs.readFileSync('.env.example', 'utf8'));

async function signedIn(email: string) {
  const s = new HttpSession();
  const res = await s.signInWithPassword(email, DEMO_PASSWORD);
  assert.ok(res.status < 400 && s.hasCookie(/session-token/), `${email} signs in (${res.status})`);
  return s;
}

test('the demo listens on 127.0.0.1 only (no other interface reaches it)', async () => {
  const listening = execFileSync('ss', ['-ltnH', `sport = :${PORT}`], { encoding: 'utf8' })
    .trim()
    .split('\n')
    .filter(Boolean);
  assert.ok(listening.length >= 1, 'the app is listening');
  for (const line of listening)
    assert.match(line.split(/\s+/)[3], new RegExp(`^127\\.0\\.0\\.1:${PORT}$`), `only loopback: ${line}`);
  const external = Object.values(os.networkInterfaces())
    .flat()
    .find((i) => i && i.family === 'IPv4' && !i.internal);
  if (external) {
    await assert.rejects(
      fetch(`http://${external.address}:${PORT}/api/health`),
      `not reachable on ${external.address}`,
    );
  }
});

test('no proxy declared: forged X-Forwarded-For (or X-Real-IP) buys no fresh public-API quota', async () => {
  const limit = Number(process.env.PUBLIC_API_RATE_LIMIT_PER_MINUTE ?? 600);
  const client = randomLoopback();
  const body = JSON.stringify({ readingsMm: [101.93], maxMm: 102, expandedUncertaintyMm: 0.05, rule: 'simple' });
  const post = (headers: Record<string, string> = {}, from = client) =>
    fromAddress(from, '/api/v1/conformity', {
      method: 'POST',
      headers: { 'content-type': 'application/json', ...headers },
      body,
    });

  assert.equal((await post()).status, 200);
  const rows = await query<{ key: string }>('select key from auth_throttles where key = $1', [
    `rate:public-api:${client}`,
  ]);
  assert.equal(rows.length, 1, 'the counter is keyed on the socket address');
  await query('update auth_throttles set attempts = $2, window_started_at = now() where key = $1', [
    rows[0].key,
    limit,
  ]);

  const forgeries: Record<string, string>[] = [
    { 'x-forwarded-for': '2001:db8::77' },
    { 'x-forwarded-for': `198.51.100.${Math.floor(Math.random() * 250)}, 203.0.113.5` },
    { 'x-real-ip': '203.0.113.99' },
    { forwarded: 'for=192.0.2.60' },
  ];
  for (const headers of forgeries) {
    const res = await post(headers);
    assert.equal(res.status, 429, `${JSON.stringify(headers)} is still the same client: ${res.body}`);
  }
  assert.equal(
    (await query('select 1 from auth_throttles where key like $1', ['rate:public-api:%203.0.113%'])).length,
    0,
    'no counter for a forged address',
  );
  assert.equal((await post({}, randomLoopback())).status, 200, 'another socket address is another client');
});

test('the outbox: anonymous visitors are sent to sign in; every role but the site administrator is refused', async () => {
  const anon = await fetch(`${BASE_URL}/dev/outbox`, { redirect: 'manual' });
  assert.ok([303, 307].includes(anon.status), `redirect, got ${anon.status}`);
  assert.match(anon.headers.get('location') ?? '', /\/sign-in\?callbackUrl=%2Fdev%2Foutbox$/);

  for (const email of [DEMO.organiser, DEMO.chief, DEMO.scrutineer, DEMO.steward, DEMO.entrant]) {
    const s = await signedIn(email);
    const res = await s.fetch('/dev/outbox');
    const text = await res.text();
    assert.ok([303, 307].includes(res.status), `${email}: redirected away, got ${res.status}`);
    assert.match(res.headers.get('location') ?? '', /\/not-allowed$/, email);
    assert.doesNotMatch(text, /api\/auth\/callback\/email|\/invitations\//, `${email} sees no link`);
  }

  // Someone asks for a sign-in link for the administrator; only the administrator can read it.
  const admin = await signedIn(DEMO.admin);
  const res = await admin.fetch('/dev/outbox');
  assert.equal(res.status, 200);
  assert.match(await res.text(), /Outbox/);
});

test('.env.example holds no usable webhook secret, and an event signed with its value is refused', async () => {
  assert.equal(example.get('STRIPE_WEBHOOK_SECRET'), '', 'no committed webhook secret');
  const payload = JSON.stringify({
    id: `evt_example_${Date.now()}`,
    object: 'event',
    type: 'customer.created',
    created: Math.floor(Date.now() / 1000),
    data: { object: { id: 'cus_1', object: 'customer' } },
  });
  for (const secret of [example.get('STRIPE_WEBHOOK_SECRET')!, ...PUBLISHED_SECRETS.STRIPE_WEBHOOK_SECRET]) {
    const header = Stripe.webhooks.generateTestHeaderString({ payload, secret });
    const res = await fetch(`${BASE_URL}/api/payments/webhook`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'stripe-signature': header },
      body: payload,
    });
    assert.equal(res.status, 400, `signed with "${secret}"`);
    assert.equal((await res.json()).error.code, 'bad_signature');
  }
});

// A second app server from the same build, set up like an old install that never ran the secret
// generator and outside the demo: the outbox does not exist, and the committed secret verifies nothing.
describeSecondServer();
function describeSecondServer() {
  const port = PORT + 9;
  let app: ChildProcess;
  before(async () => {
    app = spawn('node', ['scripts/server.mjs'], {
      // Declared behind one proxy, so it leaves compression to the proxy.
      env: {
        ...process.env,
        PORT: String(port),
        TRUSTED_PROXY_HOPS: '1',
        BORELINE_DEV_TOOLS: '',
        STRIPE_WEBHOOK_SECRET: PUBLISHED_SECRETS.STRIPE_WEBHOOK_SECRET[0],
      },
      stdio: 'ignore',
      detached: true,
    });
    for (let i = 0; i < 150; i++) {
      try {
        if ((await fetch(`http://127.0.0.1:${port}/api/health`)).ok) return;
      } catch {
        /* not up yet */
      }
      await new Promise((r) => setTimeout(r, 200));
    }
    throw new Error('the second app server did not start');
  });
  after(() => {
    if (app.pid) process.kill(-app.pid, 'SIGTERM');
  });

  test('compression: on with no proxy declared, off behind one (the proxy compresses)', async () => {
    const gz = { 'accept-encoding': 'gzip' };
    assert.equal(
      (await fetch(`${BASE_URL}/calculator`, { headers: gz })).headers.get('content-encoding'),
      'gzip',
      'the demo app compresses',
    );
    assert.equal(
      (await fetch(`http://127.0.0.1:${port}/calculator`, { headers: gz })).headers.get('content-encoding'),
      null,
      'behind a proxy it does not',
    );
  });

  test('outside the demo the outbox is 404, even for the site administrator', async () => {
    const admin = await signedIn(DEMO.admin);
    const res = await fetch(`http://127.0.0.1:${port}/dev/outbox`, {
      headers: { cookie: admin.cookieHeader() },
      redirect: 'manual',
    });
    assert.equal(res.status, 404);
    assert.equal(
      (await fetch(`http://127.0.0.1:${port}/dev/outbox`, { redirect: 'manual' })).status,
      404,
      'anonymous too',
    );
  });

  test('an app configured with a webhook secret once committed refuses every event, even one signed with it', async () => {
    const secret = PUBLISHED_SECRETS.STRIPE_WEBHOOK_SECRET[0];
    const payload = JSON.stringify({
      id: `evt_published_${Date.now()}`,
      object: 'event',
      type: 'customer.created',
      created: Math.floor(Date.now() / 1000),
      data: { object: { id: 'cus_1', object: 'customer' } },
    });
    const header = Stripe.webhooks.generateTestHeaderString({ payload, secret });
    const res = await fetch(`http://127.0.0.1:${port}/api/payments/webhook`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'stripe-signature': header },
      body: payload,
    });
    assert.equal(res.status, 503, 'not configured, not accepted');
    assert.equal((await res.json()).error.code, 'payments_unavailable');
    assert.equal((await query('select 1 from payment_events where id = $1', [JSON.parse(payload).id])).length, 0);
  });
}

test('the serve check recognises the local fakes on any port by asking them', async () => {
  const { probeFakes } = await import('../../scripts/serve-config');
  const { startPaymentsFake } = await import('../../scripts/fakes/payments');
  const { startStorageFake } = await import('../../scripts/fakes/storage');
  const { startMailFake } = await import('../../scripts/fakes/mail');
  const { mkdtempSync, rmSync } = await import('node:fs');
  const net = await import('node:net');
  const dir = mkdtempSync(`${os.tmpdir()}/boreline-probe-`);
  const freePort = () =>
    new Promise<number>((resolve) => {
      const s = net.createServer().listen(0, '127.0.0.1', () => {
        const p = (s.address() as { port: number }).port;
        s.close(() => resolve(p));
      });
    });
  const payments = startPaymentsFake({
    port: 0,
    secretKey: 'sk_test_probe',
    webhookSecret: 'whsec_probe',
    webhookUrl: 'http://127.0.0.1:9/none',
    storeFile: `${dir}/p.json`,
  });
  const storage = startStorageFake({ port: 0, rootDir: `${dir}/s`, accessKeyId: 'probe' });
  const [smtpPort, httpPort] = [await freePort(), await freePort()];
  const mail = startMailFake({ smtpPort, httpPort, storeFile: `${dir}/m.json` });
  try {
    await Promise.all(
      [payments.server, storage.server].map((s) => (s.listening ? null : new Promise((r) => s.once('listening', r)))),
    );
    const port = (s: { address(): unknown }) => (s.address() as { port: number }).port;
    const problems = await probeFakes({
      STRIPE_API_URL: `http://127.0.0.1:${port(payments.server)}`,
      S3_ENDPOINT: `http://127.0.0.1:${port(storage.server)}`,
      SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    });
    for (const name of ['STRIPE_API_URL', 'S3_ENDPOINT', 'SMTP_URL'])
      assert.ok(
        problems.some((p) => p.startsWith(`${name} `)),
        `${name}: ${JSON.stringify(problems)}`,
      );
    // Something else on loopback (here the app itself) is not taken for a fake.
    assert.deepEqual(
      await probeFakes({ STRIPE_API_URL: BASE_URL, S3_ENDPOINT: '', SMTP_URL: `smtp://127.0.0.1:${await freePort()}` }),
      [],
    );
  } finally {
    payments.server.close();
    storage.server.close();
    await mail.close();
    rmSync(dir, { recursive: true, force: true });
  }
});
