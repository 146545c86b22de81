import { BASE_URL } from './env';

// A tiny HTTP client with a cookie jar, for driving next-auth's real endpoints.
export class HttpSession {
  private cookies = new Map<string, string>();

  cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
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
    const res = await fetch(url, { ...init, headers, redirect: 'manual' });
    this.store(res);
    return res;
  }

  async json(path: string, body: unknown, method = 'POST') {
    const res = await this.fetch(path, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
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

  async session(): Promise<{ user?: { id?: string; email?: string } } | null> {
    const res = await this.fetch('/api/auth/session');
    const body = await res.json();
    return body && Object.keys(body).length ? body : null;
  }
}
