// A local stand-in for the card-payment provider's API (Stripe's v1 shape), on loopback, for the
// stripe SDK pointed at it: Checkout Sessions, refunds, a plainly labelled fake payment page, and
// signed webhooks delivered to the app. State is kept in memory and in a JSON file.
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import { createHash, randomBytes } from 'node:crypto';
import Stripe from 'stripe';

type Obj = Record<string, unknown>;
type Session = Obj & {
  id: string;
  amount_total: number;
  currency: string;
  status: string;
  payment_status: string;
  metadata: Obj;
  success_url: string;
  cancel_url: string | null;
  payment_intent: string | null;
};
type Intent = {
  id: string;
  chargeId: string;
  sessionId: string;
  amount: number;
  amountRefunded: number;
  currency: string;
  metadata: Obj;
  created: number;
};
type Attempt = { at: string; status: number | null; error?: string };
type EventRecord = {
  id: string;
  type: string;
  created: number;
  payload: string;
  signatureHeader: string;
  webhookUrl: string;
  delivered: boolean;
  attempts: Attempt[];
};
type State = {
  sessions: Record<string, Session>;
  descriptions: Record<string, string>;
  intents: Record<string, Intent>;
  refunds: Record<string, Obj>;
  events: EventRecord[];
  idempotency: Record<string, { fingerprint: string; status: number; body: string }>;
};

class ApiFailure extends Error {
  constructor(
    public status: number,
    public body: Obj,
    public saveIdempotent = false,
  ) {
    super(String(body.message));
  }
}
const invalid = (message: string, extra: Obj = {}, status = 400) =>
  new ApiFailure(status, { type: 'invalid_request_error', message, ...extra });

const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString('base64url').replace(/[-_]/g, 'x')}`;
const now = () => Math.floor(Date.now() / 1000);
const escapeHtml = (t: string) => t.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
// Currencies whose amounts have no minor unit (Stripe's published list of zero-decimal currencies).
const ZERO_DECIMAL = new Set('bif clp djf gnf jpy kmf krw mga pyg rwf ugx vnd vuv xaf xof xpf'.split(' '));
const formatAmount = (minor: number, currency: string) =>
  new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(
    ZERO_DECIMAL.has(currency) ? minor : minor / 100,
  );

/** Form-encoded keys as the SDK writes them (`a[b][0][c]=v`) into nested objects and arrays. */
export function parseForm(body: string): Obj {
  const root: Obj = {};
  for (const [key, value] of new URLSearchParams(body)) {
    const segs = key.replace(/\]/g, '').split('[');
    let node = root;
    segs.forEach((seg, i) => {
      if (i === segs.length - 1) node[seg] = value;
      else node = (node[seg] ??= {}) as Obj;
    });
  }
  const arrayify = (v: unknown): unknown => {
    if (!v || typeof v !== 'object') return v;
    const entries = Object.entries(v as Obj).map(([k, x]) => [k, arrayify(x)] as const);
    return entries.length && entries.every(([k]) => /^\d+$/.test(k))
      ? entries.sort((a, b) => +a[0] - +b[0]).map(([, x]) => x)
      : Object.fromEntries(entries);
  };
  return arrayify(root) as Obj;
}

const int = (v: unknown, param: string, min: number) => {
  const n = Number(v);
  if (v === undefined || v === '' || !Number.isInteger(n) || n < min)
    throw invalid(`Invalid integer: ${String(v)}`, { param, code: 'parameter_invalid_integer' });
  return n;
};
const required = (v: unknown, param: string) => {
  if (v === undefined || v === '')
    throw invalid(`Missing required param: ${param}.`, { param, code: 'parameter_missing' });
  return String(v);
};

export function startPaymentsFake(opts: {
  port: number;
  secretKey: string;
  webhookSecret: string;
  webhookUrl: string;
  storeFile: string;
  publicUrl?: string;
}) {
  // Port 0 (tests) means "any free port": the page address is known only once listening.
  const publicUrl = () => opts.publicUrl ?? `http://127.0.0.1:${(server.address() as { port: number }).port}`;
  const empty = (): State => ({
    sessions: {},
    descriptions: {},
    intents: {},
    refunds: {},
    events: [],
    idempotency: {},
  });
  const state: State = fs.existsSync(opts.storeFile)
    ? { ...empty(), ...JSON.parse(fs.readFileSync(opts.storeFile, 'utf8')) }
    : empty();
  const persist = () => {
    state.events = state.events.slice(-500);
    const keys = Object.keys(state.idempotency);
    for (const k of keys.slice(0, Math.max(0, keys.length - 1000))) delete state.idempotency[k];
    fs.mkdirSync(path.dirname(opts.storeFile), { recursive: true });
    fs.writeFileSync(`${opts.storeFile}.tmp`, JSON.stringify(state));
    fs.renameSync(`${opts.storeFile}.tmp`, opts.storeFile);
  };
  // The SDK's own signing helper, so the header is exactly what constructEvent expects.
  const signer = new Stripe(opts.secretKey);

  async function deliver(ev: EventRecord) {
    ev.signatureHeader = signer.webhooks.generateTestHeaderString({ payload: ev.payload, secret: opts.webhookSecret });
    const attempt: Attempt = { at: new Date().toISOString(), status: null };
    try {
      const res = await fetch(ev.webhookUrl, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': ev.signatureHeader,
          'user-agent': 'boreline-payments-fake',
        },
        body: ev.payload,
        signal: AbortSignal.timeout(5000),
      });
      attempt.status = res.status;
      await res.arrayBuffer().catch(() => null);
    } catch (err) {
      attempt.error = (err as Error).message;
    }
    ev.attempts.push(attempt);
    ev.delivered = attempt.status !== null && attempt.status >= 200 && attempt.status < 300;
    persist();
    return ev.delivered;
  }

  /** First attempt awaited (so a redirect lands after it); retries continue with backoff. */
  async function deliverWithRetries(ev: EventRecord) {
    if (await deliver(ev)) return;
    void (async () => {
      for (const delayMs of [500, 1500, 3500, 7500]) {
        await new Promise((r) => setTimeout(r, delayMs));
        if (await deliver(ev)) return;
      }
      console.log(
        `[fakes] payments: ${ev.type} ${ev.id} not accepted by ${ev.webhookUrl} after ${ev.attempts.length} attempts`,
      );
    })();
  }

  function emit(type: string, object: Obj, webhookUrl = opts.webhookUrl) {
    const id = newId('evt');
    const created = now();
    const payload = JSON.stringify(
      {
        id,
        object: 'event',
        api_version: Stripe.API_VERSION,
        created,
        data: { object },
        livemode: false,
        pending_webhooks: 1,
        request: { id: null, idempotency_key: null },
        type,
      },
      null,
      2,
    );
    const ev: EventRecord = {
      id,
      type,
      created,
      payload,
      signatureHeader: '',
      webhookUrl,
      delivered: false,
      attempts: [],
    };
    state.events.push(ev);
    persist();
    return ev;
  }

  function createSession(p: Obj): Session {
    if (p.mode !== 'payment') throw invalid('This fake supports mode=payment only.', { param: 'mode' });
    const items = p.line_items as Obj[] | undefined;
    if (!Array.isArray(items) || items.length === 0)
      throw invalid('Missing required param: line_items.', { param: 'line_items', code: 'parameter_missing' });
    let total = 0;
    let currency = '';
    items.forEach((item, i) => {
      const pd = (item.price_data ?? {}) as Obj;
      const cur = required(pd.currency, `line_items[${i}][price_data][currency]`).toLowerCase();
      if (!/^[a-z]{3}$/.test(cur) || (currency && cur !== currency))
        throw invalid('Invalid currency.', { param: `line_items[${i}][price_data][currency]` });
      currency = cur;
      required((pd.product_data as Obj | undefined)?.name, `line_items[${i}][price_data][product_data][name]`);
      total +=
        int(pd.unit_amount, `line_items[${i}][price_data][unit_amount]`, 0) *
        int(item.quantity, `line_items[${i}][quantity]`, 1);
    });
    if (total < 1) throw invalid('The Checkout Session total must be at least 1 minor unit.', { param: 'line_items' });
    const id = newId('cs_test');
    const created = now();
    const session: Session = {
      id,
      object: 'checkout.session',
      amount_subtotal: total,
      amount_total: total,
      cancel_url: (p.cancel_url as string) ?? null,
      client_reference_id: (p.client_reference_id as string) ?? null,
      created,
      currency,
      customer: null,
      customer_details: p.customer_email ? { email: p.customer_email } : null,
      customer_email: (p.customer_email as string) ?? null,
      expires_at: created + 24 * 3600,
      livemode: false,
      metadata: (p.metadata as Obj) ?? {},
      mode: 'payment',
      payment_intent: null,
      payment_status: 'unpaid',
      status: 'open',
      success_url: required(p.success_url, 'success_url'),
      url: `${publicUrl()}/pay/${id}`,
    };
    state.sessions[id] = session;
    // Kept for the payment page only: Stripe lists line items through a separate call.
    state.descriptions[id] = items.map((i) => String(((i.price_data as Obj).product_data as Obj).name)).join(', ');
    persist();
    return session;
  }

  function findSession(id: string) {
    const s = state.sessions[id];
    if (!s) throw invalid(`No such checkout.session: '${id}'`, { code: 'resource_missing', param: 'session' }, 404);
    return s;
  }

  /** Marks an open session paid; a second call returns the same session and sends nothing. */
  async function paySession(id: string, webhookUrl?: string) {
    const s = findSession(id);
    if (s.status === 'complete') return { session: s, event: null };
    if (s.status !== 'open')
      throw invalid('This Checkout Session is no longer open.', { code: 'checkout_session_expired' });
    const pi: Intent = {
      id: newId('pi'),
      chargeId: newId('ch'),
      sessionId: id,
      amount: s.amount_total,
      amountRefunded: 0,
      currency: s.currency,
      metadata: s.metadata,
      created: now(),
    };
    state.intents[pi.id] = pi;
    Object.assign(s, { status: 'complete', payment_status: 'paid', payment_intent: pi.id, url: null });
    const event = emit('checkout.session.completed', s, webhookUrl);
    await deliverWithRetries(event);
    return { session: s, event };
  }

  function refund(p: Obj) {
    const piId = p.payment_intent
      ? String(p.payment_intent)
      : Object.values(state.intents).find((i) => i.chargeId === p.charge)?.id;
    if (!piId)
      throw invalid('Missing required param: payment_intent.', { param: 'payment_intent', code: 'parameter_missing' });
    const pi = state.intents[piId];
    if (!pi) throw invalid(`No such payment_intent: '${piId}'`, { code: 'resource_missing', param: 'payment_intent' });
    const remaining = pi.amount - pi.amountRefunded;
    if (remaining === 0)
      throw new ApiFailure(
        400,
        {
          type: 'invalid_request_error',
          code: 'charge_already_refunded',
          message: `Charge ${pi.chargeId} has already been refunded.`,
        },
        true,
      );
    const amount = p.amount === undefined ? remaining : int(p.amount, 'amount', 1);
    if (amount > remaining) {
      const fmt = (n: number) => formatAmount(n, pi.currency);
      throw new ApiFailure(
        400,
        {
          type: 'invalid_request_error',
          code: 'amount_too_large',
          param: 'amount',
          message: `Refund amount (${fmt(amount)}) is greater than unrefunded amount on charge (${fmt(remaining)})`,
        },
        true,
      );
    }
    pi.amountRefunded += amount;
    const re = {
      id: newId('re'),
      object: 'refund',
      amount,
      charge: pi.chargeId,
      created: now(),
      currency: pi.currency,
      metadata: (p.metadata as Obj) ?? {},
      payment_intent: pi.id,
      reason: p.reason ?? null,
      status: 'succeeded',
    };
    state.refunds[re.id] = re;
    const charge = {
      id: pi.chargeId,
      object: 'charge',
      amount: pi.amount,
      amount_captured: pi.amount,
      amount_refunded: pi.amountRefunded,
      captured: true,
      created: pi.created,
      currency: pi.currency,
      livemode: false,
      metadata: pi.metadata,
      paid: true,
      payment_intent: pi.id,
      refunded: pi.amountRefunded === pi.amount,
      status: 'succeeded',
    };
    void deliverWithRetries(emit('charge.refunded', charge));
    return re;
  }

  function paymentPage(s: Session) {
    const done = s.status === 'complete';
    const body = done
      ? `<p>This payment is already complete.</p><p><a href="${escapeHtml(successUrl(s))}">Return to the site</a></p>`
      : `<form method="post" action="/pay/${s.id}/pay"><button type="submit">Pay now</button></form>
         <form method="post" action="/pay/${s.id}/cancel"><button type="submit" class="secondary">Cancel</button></form>`;
    return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Local test payment</title><style>body{font:16px/1.5 system-ui,sans-serif;max-width:28rem;margin:2rem auto;padding:0 1rem;color:#111}
.note{border:2px dashed #a15c00;background:#fff7e6;padding:.5rem .75rem}dl{display:grid;grid-template-columns:auto 1fr;gap:.25rem 1rem}
button{font:inherit;padding:.6rem 1.2rem;margin:.5rem .5rem 0 0;border:2px solid #111;background:#111;color:#fff;cursor:pointer}
.secondary{background:#fff;color:#111}form{display:inline}</style></head><body>
<h1>Local test payment — no real money</h1><p class="note">This page belongs to a development fake. Nothing is charged.</p>
<dl><dt>For</dt><dd>${escapeHtml(state.descriptions[s.id] ?? '')}</dd><dt>Amount</dt><dd>${escapeHtml(formatAmount(s.amount_total, s.currency))}</dd>
<dt>Session</dt><dd><code>${s.id}</code></dd></dl>${body}</body></html>`;
  }
  const successUrl = (s: Session) => s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id);

  const readBody = (req: http.IncomingMessage) =>
    new Promise<string>((resolve, reject) => {
      let data = '';
      req.setEncoding('utf8');
      req.on('data', (c: string) => {
        data += c;
        if (data.length > 1_000_000) req.destroy(new Error('body too large'));
      });
      req.on('end', () => resolve(data));
      req.on('error', reject);
    });

  /** Only loopback addresses may replace the configured webhook URL (test servers). */
  const overrideUrl = (raw: string) => {
    if (!raw) return undefined;
    const body = JSON.parse(raw) as { webhookUrl?: string };
    if (!body.webhookUrl) return undefined;
    const host = URL.canParse(body.webhookUrl) ? new URL(body.webhookUrl).hostname : '';
    if (!['127.0.0.1', 'localhost', '[::1]'].includes(host))
      throw invalid('webhookUrl must be a loopback http address.');
    return body.webhookUrl;
  };

  async function apiRoute(req: http.IncomingMessage, url: URL, raw: string): Promise<[number, unknown]> {
    const auth = req.headers.authorization ?? '';
    if (!auth)
      throw invalid('You did not provide an API key. Provide it in the Authorization header as Bearer <key>.', {}, 401);
    if (auth !== `Bearer ${opts.secretKey}`)
      throw invalid(`Invalid API Key provided: ${auth.replace(/^Bearer /, '').slice(0, 8)}****`, {}, 401);
    const p = parseForm(req.method === 'GET' ? url.search.slice(1) : raw);
    const one = /^\/v1\/checkout\/sessions\/([\w-]+)$/.exec(url.pathname);
    if (req.method === 'POST' && url.pathname === '/v1/checkout/sessions') return [200, createSession(p)];
    if (req.method === 'GET' && one) return [200, findSession(one[1])];
    if (req.method === 'POST' && url.pathname === '/v1/refunds') return [200, refund(p)];
    throw invalid(`Unrecognized request URL (${req.method}: ${url.pathname}).`, {}, 404);
  }

  /** Stripe-style idempotency: the same key and parameters replay the saved answer. */
  async function withIdempotency(req: http.IncomingMessage, url: URL, raw: string, res: http.ServerResponse) {
    const key = req.method === 'POST' ? String(req.headers['idempotency-key'] ?? '') : '';
    const fingerprint = createHash('sha256').update(`${req.method} ${url.pathname}\n${raw}`).digest('hex');
    const saved = key ? state.idempotency[key] : undefined;
    if (saved) {
      if (saved.fingerprint !== fingerprint) {
        throw new ApiFailure(400, {
          type: 'idempotency_error',
          message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
        });
      }
      res.writeHead(saved.status, {
        'content-type': 'application/json',
        'idempotent-replayed': 'true',
        'idempotency-key': key,
      });
      return res.end(saved.body);
    }
    let status: number;
    let body: string;
    try {
      const [s, out] = await apiRoute(req, url, raw);
      [status, body] = [s, JSON.stringify(out)];
    } catch (err) {
      if (!(err instanceof ApiFailure) || !err.saveIdempotent) throw err;
      [status, body] = [err.status, JSON.stringify({ error: err.body })];
    }
    if (key) {
      state.idempotency[key] = { fingerprint, status, body };
      persist();
    }
    res.writeHead(status, { 'content-type': 'application/json', ...(key && { 'idempotency-key': key }) });
    res.end(body);
  }

  async function route(req: http.IncomingMessage, res: http.ServerResponse) {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    const raw = req.method === 'POST' ? await readBody(req) : '';
    const json = (status: number, data: unknown) => {
      res.writeHead(status, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ data }));
    };
    const redirect = (to: string) => {
      res.writeHead(303, { location: to });
      res.end();
    };
    let m: RegExpExecArray | null;
    if (url.pathname.startsWith('/v1/')) return withIdempotency(req, url, raw, res);
    if (req.method === 'GET' && (m = /^\/pay\/([\w-]+)$/.exec(url.pathname))) {
      res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
      return res.end(paymentPage(findSession(m[1])));
    }
    if (req.method === 'POST' && (m = /^\/pay\/([\w-]+)\/pay$/.exec(url.pathname)))
      return redirect(successUrl((await paySession(m[1])).session));
    if (req.method === 'POST' && (m = /^\/pay\/([\w-]+)\/cancel$/.exec(url.pathname))) {
      const s = findSession(m[1]);
      if (s.cancel_url) return redirect(s.cancel_url);
      res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
      return res.end(
        '<!doctype html><html lang="en"><title>Cancelled</title><p>Payment cancelled. You can close this page.</p></html>',
      );
    }
    if (req.method === 'GET' && url.pathname === '/_fake/health') return json(200, { ok: true });
    if (req.method === 'GET' && url.pathname === '/_fake/events') {
      const type = url.searchParams.get('type');
      return json(
        200,
        state.events
          .filter((e) => !type || e.type === type)
          .slice()
          .reverse(),
      );
    }
    if (req.method === 'POST' && (m = /^\/_fake\/sessions\/([\w-]+)\/pay$/.exec(url.pathname)))
      return json(200, await paySession(m[1], overrideUrl(raw)));
    if (req.method === 'POST' && (m = /^\/_fake\/events\/([\w-]+)\/resend$/.exec(url.pathname))) {
      const ev = state.events.find((e) => e.id === m![1]);
      if (!ev) throw invalid(`No such event: '${m[1]}'`, { code: 'resource_missing' }, 404);
      ev.webhookUrl = overrideUrl(raw) ?? ev.webhookUrl;
      await deliver(ev); // same id and payload, a fresh signature: a replay as the provider would send it
      return json(200, ev);
    }
    throw invalid(`Unrecognized request URL (${req.method}: ${url.pathname}).`, {}, 404);
  }

  const server = http.createServer((req, res) => {
    res.setHeader('request-id', newId('req'));
    route(req, res).catch((err: unknown) => {
      const f =
        err instanceof ApiFailure
          ? err
          : err instanceof SyntaxError
            ? invalid('Invalid JSON body.')
            : new ApiFailure(500, { type: 'api_error', message: 'The payments fake failed.' });
      if (!(err instanceof ApiFailure || err instanceof SyntaxError)) console.error('[fakes] payments error', err);
      if (res.headersSent) return res.destroy();
      res.writeHead(f.status, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ error: f.body }));
    });
  });
  server.listen(opts.port, '127.0.0.1');
  return { server, close: () => new Promise((r) => server.close(() => r(null))) };
}
