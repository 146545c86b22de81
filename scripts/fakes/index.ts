// Starts every local fake of a hosted service on loopback, in one process.
// Ports come from the environment (see .env.example); state lives under FAKES_DIR.
import path from 'node:path';
import { startMailFake } from './mail';

const dataDir = process.env.FAKES_DIR ?? path.join(process.cwd(), '.data', 'fakes');
const smtpPort = Number(new URL(process.env.SMTP_URL ?? 'smtp://127.0.0.1:2525').port || 2525);

startMailFake({
  smtpPort,
  httpPort: Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2526),
  storeFile: path.join(dataDir, 'outbox.json'),
});

console.log(`[fakes] mail: smtp 127.0.0.1:${smtpPort}, inbox http://127.0.0.1:${process.env.MAIL_FAKE_HTTP_PORT ?? 2526}/messages`);
process.on('SIGTERM', () => process.exit(0));
process.on('SIGINT', () => process.exit(0));
