// Signing out through next-auth's own endpoints (GET /api/auth/csrf, then POST /api/auth/signout with
// that token), as next-auth/react's signOut() does, without loading next-auth/react (and its runtime
// helpers) into every signed-in page for one button. No page here uses next-auth's SessionProvider, so
// there is no other tab's session state to notify. Every way out first empties what the service worker kept for
// this person (a phone at the dock may be shared).
import { clearPersonalCaches } from './offline/clear-personal-caches';

export async function signOutTo(callbackUrl: string) {
  await clearPersonalCaches().catch(() => undefined);
  const { csrfToken } = (await (await fetch('/api/auth/csrf', { cache: 'no-store' })).json()) as { csrfToken: string };
  const res = await fetch('/api/auth/signout', {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, callbackUrl, json: 'true' }),
  });
  const { url } = (await res.json().catch(() => ({}))) as { url?: string };
  window.location.href = url ?? callbackUrl;
}
