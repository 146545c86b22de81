// Starts every local fake of a hosted service on loopback, in one process.
// Ports come from the environment (see .env.example); state lives under FAKES_DIR.
import path from 'node:path';
import type { Server } from 'node:http';
import { startMailFake } from './mail';
import { startPaymentsFake } from './payments';
import { startStorageFake } from './storage';

const dataDir = process.env.FAKES_DIR ?? path.join(process.cwd(), '.data', 'fakes');
const smtpPort = Number(new URL(process.env.SMTP_URL ?? 'smtp://127.0.0.1:2525').port || 2525);

startMailFake({
  smtpPort,
  httpPort: Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2526),
  storeFile: path.join(dataDir, 'outbox.json'),
});

console.log(`[fakes] mail: smtp 127.0.0.1:${smtpPort}, inbox http://127.0.0.1:${process.env.MAIL_FAKE_HTTP_PORT ?? 2526}/messages`);

// A port already taken (a leftover fake) must stop this process loudly, not leave half the fakes up.
const failLoudly = (name: string, server: Server) =>
  server.on('error', (err) => {
    console.error(`[fakes] ${name} could not start: ${err.message}`);
    process.exit(1);
  });

const paymentsUrl = new URL(process.env.STRIPE_API_URL ?? 'http://127.0.0.1:12111');
const payments = startPaymentsFake({
  port: Number(paymentsUrl.port || 80),
  publicUrl: paymentsUrl.origin,
  secretKey: process.env.STRIPE_SECRET_KEY ?? 'sk_test_boreline_local_fake',
  webhookSecret: process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_boreline_local_fake',
  webhookUrl: process.env.PAYMENTS_WEBHOOK_URL ?? 'http://127.0.0.1:3000/api/payments/webhook',
  storeFile: path.join(dataDir, 'payments.json'),
});
failLoudly('payments', payments.server);
console.log(`[fakes] payments: API ${paymentsUrl.origin}/v1, test helpers ${paymentsUrl.origin}/_fake/events, webhooks to ${process.env.PAYMENTS_WEBHOOK_URL ?? 'http://127.0.0.1:3000/api/payments/webhook'}`);

const storageUrl = new URL(process.env.S3_ENDPOINT ?? 'http://127.0.0.1:9750');
const storage = startStorageFake({ port: Number(storageUrl.port || 80), rootDir: path.join(dataDir, 'storage') });
failLoudly('storage', storage.server);
console.log(`[fakes] storage: S3-compatible endpoint ${storageUrl.origin} (path-style), files under ${path.join(dataDir, 'storage')}`);

process.on('SIGTERM', () => process.exit(0));
process.on('SIGINT', () => process.exit(0));
