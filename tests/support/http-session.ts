import { BASE_URL } from './env';
import { waitForMail } from './mail';
import http from 'node:http';

/** One request over a socket bound to a chosen local address (fetch cannot choose it). */
function requestFrom(localAddress: string, url: string, init: RequestInit, headers: Headers): Promise<Response> {
  const u = new URL(url);
  return new Promise((resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port: u.port,
        path: `${u.pathname}${u.search}`,
        method: init.method ?? 'GET',
        localAddress,
        headers: { ...Object.fromEntries(headers), host: u.host },
      },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => {
          const h = new Headers();
          for (const [k, v] of Object.entries(res.headers))
            for (const one of Array.isArray(v) ? v : [v ?? '']) h.append(k, one);
          const status = res.statusCode ?? 0;
          const body = status === 204 || status === 304 ? null : Buffer.concat(chunks);
          resolve(new Response(body, { status, headers: h }));
        });
        res.on('error', reject);
      },
    );
    req.on('error', reject);
    if (init.body !== undefined && init.body !== null)
      req.write(typeof init.body === 'string' ? init.body : String(init.body));
    req.end();
  });
}

// A tiny HTTP client with a cookie jar, for driving next-auth's real endpoints.
export class HttpSession {
  private cookies = new Map<string, string>();

  /**
   * localAddress: connect from this loopback address (127.0.0.2, …), so the app sees another
   * client address, as it would for a person elsewhere; no header the client could forge is used.
   */
  constructor(private readonly localAddress?: string) {}

  cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  /** Takes a copy of another session's cookies (a stolen or left-behind cookie). */
  copyCookiesFrom(other: HttpSession) {
    this.cookies = new Map(other.cookies);
    return this;
  }

  hasCookie(pattern: RegExp) {
    return [...this.cookies.keys()].some((k) => pattern.test(k));
  }

  private store(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair, ...attrs] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expired = attrs.some((a) => /max-age=0/i.test(a.trim())) || value === '';
      if (expired) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  async fetch(path: string, init: RequestInit = {}): Promise<Response> {
    const url = path.startsWith('http') ? path : `${BASE_URL}${path}`;
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', this.cookieHeader());
    const res = this.localAddress
      ? await requestFrom(this.localAddress, url, init, headers)
      : await fetch(url, { ...init, headers, redirect: 'manual' });
    this.store(res);
    return res;
  }

  async json(path: string, body: unknown, method = 'POST') {
    const res = await this.fetch(path, {
      method,
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(body),
    });
    return { res, body: await res.json().catch(() => null) };
  }

  async csrfToken(): Promise<string> {
    const res = await this.fetch('/api/auth/csrf');
    return ((await res.json()) as { csrfToken: string }).csrfToken;
  }

  /** Signs in through next-auth's credentials callback, as the browser form does. */
  async signInWithPassword(email: string, password: string) {
    const csrfToken = await this.csrfToken();
    const res = await this.fetch('/api/auth/callback/password', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, email, password, json: 'true' }),
    });
    return res;
  }

  /** Creates an entrant account (202: a confirmation link is mailed) without confirming it. */
  async signUp(account: { name: string; email: string; password: string }) {
    return this.json('/api/accounts', account);
  }

  /**
   * Creates an account, confirms its address with the mailed link and the password (which signs
   * this session in), as a new entrant does. Throws if any step fails.
   */
  async signUpAndConfirm(account: { name: string; email: string; password: string }) {
    const { res, body } = await this.signUp(account);
    if (res.status !== 202) throw new Error(`sign-up answered ${res.status}: ${JSON.stringify(body)}`);
    const res2 = await this.confirmAddress(account.email, account.password);
    if (res2.status !== 200) throw new Error(`confirming ${account.email} answered ${res2.status}`);
    return res2;
  }

  /** Follows the newest confirmation link mailed to the address, giving the password. */
  async confirmAddress(email: string, password: string) {
    const mail = await waitForMail(email, { subject: /Confirm your e-mail address/ });
    const token = /\/confirm-address\/([A-Za-z0-9_-]+)/.exec(mail.text)?.[1];
    if (!token) throw new Error(`no confirmation link in the mail to ${email}`);
    const csrfToken = await this.csrfToken();
    return this.fetch('/api/auth/callback/address-proof', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, token, password, json: 'true' }),
    });
  }

  /** Follows an invitation link's token, as its acceptance page does (signs this session in when it works). */
  async acceptInvitation(token: string, name?: string) {
    const csrfToken = await this.csrfToken();
    return this.fetch('/api/auth/callback/invitation', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, token, json: 'true', ...(name !== undefined && { name }) }),
    });
  }

  async session(): Promise<{ user?: { id?: string; email?: string } } | null> {
    const res = await this.fetch('/api/auth/session');
    const body = await res.json();
    return body && Object.keys(body).length ? body : null;
  }
}
