// Shared by the load scripts: a cookie-keeping HTTP client that signs in through next-auth, a
// scratch meeting (class with published rules, the demo scrutineer on its staff, entered boats),
// and an inspection body. Records are append-only, so the scripts never touch the demo meeting.
import { randomUUID } from 'node:crypto';
import http from 'node:http';

export const BASE = process.env.BASE_URL ?? 'http://localhost:3000';
const PASSWORD = 'tarnwater-demo';

/**
 * The measured loops' client: node:http on kept-alive connections, one per concurrent loop. The load
 * runs on the same two cores as the app, PostgreSQL and the fakes, so what the client itself spends
 * per request is taken from them: fetch (undici, with a Headers object, an AbortSignal timer and
 * cookie parsing per request) cost about 1.2–1.5 ms of CPU per request here, node:http about a third
 * of that (bench:inspections prints the figure as "this bench"). Sends what a phone's browser sends:
 * the session cookie, and Accept-Encoding so that answers the app compresses are compressed.
 */
export class LoadClient {
  private readonly agent: http.Agent;
  private readonly url: URL;
  constructor(
    connections: number,
    private readonly cookie = '',
    base = BASE,
    private readonly timeoutMs = 15_000,
  ) {
    this.agent = new http.Agent({ keepAlive: true, maxSockets: connections });
    this.url = new URL(base);
  }
  /** Sends one request and reads the whole answer; resolves with its status. */
  request(method: 'GET' | 'POST', path: string, json?: unknown): Promise<{ status: number; ok: boolean }> {
    const body = json === undefined ? undefined : Buffer.from(JSON.stringify(json));
    const headers: http.OutgoingHttpHeaders = { 'accept-encoding': 'gzip, deflate, br' };
    if (this.cookie) headers.cookie = this.cookie;
    if (body) {
      headers['content-type'] = 'application/json';
      headers['content-length'] = body.length;
    }
    return new Promise((resolve, reject) => {
      const req = http.request(
        {
          host: this.url.hostname,
          port: this.url.port,
          method,
          path,
          headers,
          agent: this.agent,
          timeout: this.timeoutMs,
        },
        (res) => {
          res.on('data', () => {});
          res.on('end', () => {
            const status = res.statusCode ?? 0;
            resolve({ status, ok: status >= 200 && status < 300 });
          });
          res.on('error', reject);
        },
      );
      req.on('timeout', () => req.destroy(new Error(`${method} ${path}: no answer in ${this.timeoutMs} ms`)));
      req.on('error', reject);
      req.end(body);
    });
  }
  close() {
    this.agent.destroy();
  }
}

export class Client {
  private cookies = new Map<string, string>();
  /** timeoutMs: how long one request may take (setting up a meeting after a burst waits behind the mail queue). */
  constructor(
    private readonly timeoutMs = 15_000,
    /** Where to send requests (another app server, or nginx in front of several). */
    public base = BASE,
  ) {}
  /** The session cookies, to carry to another base address. */
  cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }
  async fetch(path: string, init: RequestInit = {}) {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '));
    const res = await fetch(`${this.base}${path}`, {
      ...init,
      headers,
      redirect: 'manual',
      signal: init.signal ?? AbortSignal.timeout(this.timeoutMs),
    });
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair.indexOf('=');
      this.cookies.set(pair.slice(0, eq).trim(), pair.slice(eq + 1).trim());
    }
    return res;
  }
  async json(path: string, body: unknown, method = 'POST') {
    const res = await this.fetch(path, {
      method,
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(body),
    });
    const json = await res.json().catch(() => null);
    if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${JSON.stringify(json)}`);
    return json.data;
  }
  async signIn(email: string) {
    const { csrfToken } = await (await this.fetch('/api/auth/csrf')).json();
    const res = await this.fetch('/api/auth/callback/password', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, email, password: PASSWORD, json: 'true' }),
    });
    const answer = await res.text();
    const session = await (await this.fetch('/api/auth/session')).json();
    if (!session?.user) throw new Error(`could not sign in as ${email}: ${res.status} ${answer.slice(0, 200)}`);
    return this;
  }
}

export async function setUpScratchMeeting(boats: number) {
  // A long timeout: after an earlier burst, thousands of result e-mails may still be draining through the
  // app's 3-connection SMTP pool, and adding staff sends an e-mail that waits its turn.
  const organiser = await new Client(180_000).signIn('organiser@tarnwater.example');
  const event = await organiser.json('/api/events', {
    organisationId: '0b0e0000-0000-4000-8000-000000000001',
    name: `Load meeting ${new Date().toISOString()}`,
    venue: 'Load Reach',
    startsOn: '2027-06-01',
    endsOn: '2027-06-02',
    timeZone: 'Pacific/Auckland',
    status: 'entries_open',
    waterKind: 'fresh',
    waterTemperatureC: 15,
    waterDensityKgM3: null,
    protestWindowMinutes: 30,
    currency: 'NZD',
    entryFeeMinor: 10000,
    protestFeeMinor: 3000,
  });
  await organiser.json(`/api/events/${event.id}/staff`, { email: 'scrutineer@tarnwater.example', role: 'scrutineer' });
  const cls = await organiser.json(`/api/events/${event.id}/classes`, { name: 'Load Class', code: 'LOAD' });
  await organiser.json(
    `/api/events/${event.id}/classes/${cls.id}/rules`,
    {
      powerUnit: 'kW',
      rules: {
        nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
        power: { minKw: 180, maxKw: 260, defaultUncertaintyKw: 5 },
        weight: { minKg: 650, includesDriver: true, defaultUncertaintyKg: 1 },
        decisionRule: 'iso14253',
        safetyItems: ['kill_switch', 'helmet'],
        parity: {
          pumpEfficiency: 0.9,
          nozzleLossCoefficient: 0.02,
          inletLossCoefficient: 0.2,
          wakeFraction: 0,
          referenceSpeedsMs: [10],
        },
      },
    },
    'PUT',
  );
  await organiser.json(`/api/events/${event.id}/classes/${cls.id}/rules/publish`, {
    changeNote: 'load',
    effectiveFrom: new Date(Date.now() - 3600_000).toISOString(),
  });
  const entrant = await new Client().signIn('entrant@tarnwater.example');
  const entryIds: string[] = [];
  for (let i = 0; i < boats; i++) {
    const boat = await entrant.json('/api/boats', {
      name: `Load boat ${i + 1}`,
      nozzleDiameter: 101.5,
      nozzleUnit: 'mm',
      nozzleToleranceMm: 0.1,
      power: 220,
      powerUnit: 'kW',
      powerEvidence: 'dyno_sheet',
    });
    const entered = await entrant.json('/api/entries', { eventId: event.id, classId: cls.id, boatId: boat.id });
    entryIds.push(entered.entry.id);
  }
  return { eventId: event.id as string, entryIds };
}

export const inspectionBody = (entryId: string, key: string = randomUUID()) => ({
  idempotencyKey: key,
  entryId,
  kind: 'pre_race',
  capturedAt: new Date().toISOString(),
  device: 'load',
  nozzle: {
    readings: [
      { diameterMm: 101.5, angleDeg: 0 },
      { diameterMm: 101.93, angleDeg: 60 },
      { diameterMm: 101.7, angleDeg: 120 },
    ],
    expandedUncertaintyMm: 0.05,
  },
  weight: { readingsKg: [690, 691] },
  power: { declaredKw: 220, evidenceSeen: true },
  safety: { kill_switch: true, helmet: true },
});

export const percentile = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))] : NaN;
};
