// Every install makes its own secrets: creates .env from .env.example when missing, then fills each
// secret (lib/server/config/published-values.ts, SECRET_NAMES) that is empty or still holds a value once
// published in this repository with a fresh random one. Run by scripts/start.sh and scripts/serve.sh;
// safe to run twice (a generated value is kept). Prints the names it filled, never the values.
import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import {
  LOCAL_FAKE_MARK,
  SECRET_NAMES,
  isPublishedSecret,
  parseDotenv,
  type SecretName,
} from '../lib/server/config/published-values';

const random = (bytes: number) => randomBytes(bytes).toString('base64url');
const hex = (bytes: number) => randomBytes(bytes).toString('hex');

/** A fresh value per secret; the keys shared with the local fakes are marked as theirs. */
export function generateSecret(name: SecretName): string {
  switch (name) {
    case 'NEXTAUTH_SECRET':
      return random(32);
    case 'STRIPE_SECRET_KEY':
      return `sk_test_${LOCAL_FAKE_MARK}_${hex(24)}`;
    case 'STRIPE_WEBHOOK_SECRET':
      return `whsec_${LOCAL_FAKE_MARK}_${random(32)}`;
    case 'S3_ACCESS_KEY_ID':
      return `${LOCAL_FAKE_MARK}${hex(8)}`;
    case 'S3_SECRET_ACCESS_KEY':
      return random(30);
  }
}

/** The .env text with every missing or published secret replaced; `filled` names what changed. */
export function fillSecrets(envText: string): { text: string; filled: string[] } {
  const current = parseDotenv(envText);
  const filled: string[] = [];
  let text = envText;
  for (const name of SECRET_NAMES) {
    if (!isPublishedSecret(name, current.get(name))) continue;
    const line = `${name}=${generateSecret(name)}`;
    // Every line that sets it (a shell reads the last one), so no stale copy survives.
    const pattern = new RegExp(`^\\s*(?:export\\s+)?${name}\\s*=.*$`, 'gm');
    text = pattern.test(text) ? text.replace(pattern, line) : `${text.replace(/\n?$/, '\n')}${line}\n`;
    filled.push(name);
  }
  // The database password inside DATABASE_URL: the published "boreline" (or none) becomes a fresh one.
  const db = current.get('DATABASE_URL');
  if (db && URL.canParse(db)) {
    const u = new URL(db);
    if (u.password === '' || decodeURIComponent(u.password) === 'boreline') {
      u.password = hex(24);
      text = text.replace(/^\s*(?:export\s+)?DATABASE_URL\s*=.*$/gm, `DATABASE_URL=${u.toString()}`);
      filled.push('the DATABASE_URL password');
    }
  }
  return { text, filled };
}

function main() {
  const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
  // BORELINE_ENV_FILE lets a test work on a scratch copy instead of the install's own .env.
  const envFile = path.resolve(process.env.BORELINE_ENV_FILE || path.join(root, '.env'));
  const created = !fs.existsSync(envFile);
  const before = created ? fs.readFileSync(path.join(root, '.env.example'), 'utf8') : fs.readFileSync(envFile, 'utf8');
  const { text, filled } = fillSecrets(before);
  if (created || filled.length) {
    fs.writeFileSync(`${envFile}.tmp`, text, { mode: 0o600 });
    fs.renameSync(`${envFile}.tmp`, envFile);
  }
  fs.chmodSync(envFile, 0o600);
  if (created)
    console.log(`[boreline] created ${path.basename(envFile)} from .env.example with fresh ${filled.join(', ')}`);
  else if (filled.length)
    console.log(
      `[boreline] ${path.basename(envFile)}: replaced ${filled.join(', ')} (empty or a value published in the repository) with fresh values`,
    );
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(new URL(import.meta.url).pathname)) main();
