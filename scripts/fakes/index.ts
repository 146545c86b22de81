// Starts every local fake of a hosted service on loopback, in one process.
// Ports, keys and secrets come from the environment (.env, generated per install by
// scripts/env-secrets.mjs; scripts/test.sh makes throwaway ones): there are no built-in defaults,
// so no key that the fakes accept is ever read from a committed file. State lives under FAKES_DIR.
import path from 'node:path';
import type { Server } from 'node:http';
import { startMailFake } from './mail';
import { startPaymentsFake } from './payments';
import { startStorageFake } from './storage';

const REQUIRED = [
  'SMTP_URL',
  'MAIL_FAKE_HTTP_PORT',
  'STRIPE_API_URL',
  'STRIPE_SECRET_KEY',
  'STRIPE_WEBHOOK_SECRET',
  'PAYMENTS_WEBHOOK_URL',
  'S3_ENDPOINT',
  'S3_ACCESS_KEY_ID',
] as const;
const missing = REQUIRED.filter((name) => !process.env[name]?.trim());
if (missing.length) {
  console.error(`[fakes] not started: set ${missing.join(', ')} (npm start writes them into .env)`);
  process.exit(1);
}
const env = (name: (typeof REQUIRED)[number]) => process.env[name]!.trim();

const dataDir = process.env.FAKES_DIR ?? path.join(process.cwd(), '.data', 'fakes');
const smtpPort = Number(new URL(env('SMTP_URL')).port || 25);
const mailHttpPort = Number(env('MAIL_FAKE_HTTP_PORT'));

startMailFake({ smtpPort, httpPort: mailHttpPort, storeFile: path.join(dataDir, 'outbox.json') });
console.log(
  `[fakes] mail: smtp 127.0.0.1:${smtpPort}, inbox http://127.0.0.1:${mailHttpPort}/messages (loopback only)`,
);

// A port already taken (a leftover fake) must stop this process loudly, not leave half the fakes up.
const failLoudly = (name: string, server: Server) =>
  server.on('error', (err) => {
    console.error(`[fakes] ${name} could not start: ${err.message}`);
    process.exit(1);
  });

const paymentsUrl = new URL(env('STRIPE_API_URL'));
const payments = startPaymentsFake({
  port: Number(paymentsUrl.port || 80),
  publicUrl: paymentsUrl.origin,
  secretKey: env('STRIPE_SECRET_KEY'),
  webhookSecret: env('STRIPE_WEBHOOK_SECRET'),
  webhookUrl: env('PAYMENTS_WEBHOOK_URL'),
  storeFile: path.join(dataDir, 'payments.json'),
});
failLoudly('payments', payments.server);
console.log(
  `[fakes] payments: API ${paymentsUrl.origin}/v1, test helpers ${paymentsUrl.origin}/_fake/events, webhooks to ${env('PAYMENTS_WEBHOOK_URL')}`,
);

const storageUrl = new URL(env('S3_ENDPOINT'));
const storage = startStorageFake({
  port: Number(storageUrl.port || 80),
  rootDir: path.join(dataDir, 'storage'),
  accessKeyId: env('S3_ACCESS_KEY_ID'),
});
failLoudly('storage', storage.server);
console.log(
  `[fakes] storage: S3-compatible endpoint ${storageUrl.origin} (path-style), files under ${path.join(dataDir, 'storage')}`,
);

process.on('SIGTERM', () => process.exit(0));
process.on('SIGINT', () => process.exit(0));
