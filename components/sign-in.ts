// Signing in through next-auth's own endpoints, as next-auth/react's signIn(provider, { redirect: false }) does,
// without loading next-auth/react into the page: GET /api/auth/csrf, then the form POST with that token
// (POST /api/auth/callback/<provider> for the password, address-proof and invitation providers, POST
// /api/auth/signin/email for a link), answered with JSON { url } whose `error` parameter names a refusal.
// Two requests instead of next-auth/react's four (it also asks for the provider list first and for the session
// after, for a SessionProvider no page here uses): on one bar of signal, each is a round trip saved.
// components/sign-out.ts does the same for signing out.

export type SignInProvider = 'password' | 'email' | 'address-proof' | 'invitation';

/** What next-auth/react's signIn answers with redirect: false. */
export type SignInAnswer = { ok: boolean; status: number; error: string | null; url: string | null };

/** Throws when Boreline cannot be reached or answers with something other than next-auth's JSON. */
export async function signInWith(
  provider: SignInProvider,
  fields: Record<string, string>,
  callbackUrl: string = window.location.href,
): Promise<SignInAnswer> {
  const { csrfToken } = (await (await fetch('/api/auth/csrf', { cache: 'no-store' })).json()) as { csrfToken: string };
  const res = await fetch(provider === 'email' ? '/api/auth/signin/email' : `/api/auth/callback/${provider}`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ ...fields, csrfToken, callbackUrl, json: 'true' }),
  });
  const data = (await res.json()) as { url: string };
  const error = new URL(data.url, window.location.href).searchParams.get('error');
  return { ok: res.ok, status: res.status, error, url: error ? null : data.url };
}
