// Values that anyone can read in this repository or its history, and so must never sign,
// authenticate or unlock anything. Framework-free: used by the secret generator
// (scripts/env-secrets.ts), the serve mode's configuration check (scripts/serve-config.ts) and the
// payment webhook check (lib/server/payments/stripe.ts).

/** Every secret the app and the fakes use; each install generates its own into the ignored .env. */
export const SECRET_NAMES = [
  'NEXTAUTH_SECRET',
  'STRIPE_SECRET_KEY',
  'STRIPE_WEBHOOK_SECRET',
  'S3_ACCESS_KEY_ID',
  'S3_SECRET_ACCESS_KEY',
] as const;
export type SecretName = (typeof SECRET_NAMES)[number];

/** What .env.example and scripts/test.sh held before secrets were generated per install. */
export const PUBLISHED_SECRETS: Record<SecretName, readonly string[]> = {
  NEXTAUTH_SECRET: ['replace-me', 'test-secret-not-for-production-use-0123456789'],
  STRIPE_SECRET_KEY: ['sk_test_boreline_local_fake'],
  STRIPE_WEBHOOK_SECRET: ['whsec_boreline_local_fake', 'whsec_boreline_test_fake'],
  S3_ACCESS_KEY_ID: ['boreline-local'],
  S3_SECRET_ACCESS_KEY: ['boreline-local-secret'],
};

/** Generated values for the local fakes carry this mark, so a real install can tell them apart. */
export const LOCAL_FAKE_MARK = 'localfake';

/** True for a value that must not be trusted: empty, or published in this repository. */
export function isPublishedSecret(name: SecretName, value: string | undefined): boolean {
  const v = value?.trim() ?? '';
  return v === '' || PUBLISHED_SECRETS[name].includes(v);
}

/** KEY=value lines of a dotenv file (comments and blank lines skipped; surrounding quotes removed). */
export function parseDotenv(text: string): Map<string, string> {
  const out = new Map<string, string>();
  for (const line of text.split(/\r?\n/)) {
    const m = /^\s*(?:export\s+)?([A-Za-z_][A-Za-z0-9_]*)\s*=(.*)$/.exec(line);
    if (!m) continue;
    let v = m[2].trim();
    if ((v.startsWith('"') && v.endsWith('"')) || (v.startsWith("'") && v.endsWith("'"))) v = v.slice(1, -1);
    out.set(m[1], v);
  }
  return out;
}
