// A local stand-in for an SMTP relay: accepts every message on loopback, keeps it in memory
// and in a JSON file, and shows it over a small read-only HTTP inbox for people and tests.
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';

export type StoredMessage = {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
};

export function startMailFake(opts: { smtpPort: number; httpPort: number; storeFile: string }) {
  const messages: StoredMessage[] = fs.existsSync(opts.storeFile)
    ? (JSON.parse(fs.readFileSync(opts.storeFile, 'utf8')) as StoredMessage[])
    : [];
  // Written at most every 200 ms (and on exit), not on every message: under load the whole file
  // rewritten per message cost this fake more CPU than the app spent recording the inspection.
  const write = () => {
    fs.mkdirSync(path.dirname(opts.storeFile), { recursive: true });
    fs.writeFileSync(`${opts.storeFile}.tmp`, JSON.stringify(messages.slice(-500), null, 1));
    fs.renameSync(`${opts.storeFile}.tmp`, opts.storeFile);
  };
  let pending: NodeJS.Timeout | undefined;
  const persist = () => {
    pending ??= setTimeout(() => {
      pending = undefined;
      write();
    }, 200);
  };
  const flush = () => {
    if (!pending) return;
    clearTimeout(pending);
    pending = undefined;
    write();
  };
  process.on('exit', flush);

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    banner: 'boreline mail fake',
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const to = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
          messages.push({
            id: randomUUID(),
            receivedAt: new Date().toISOString(),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to,
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : '',
          });
          if (messages.length > 5000) messages.splice(0, messages.length - 5000);
          persist();
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  // A client that vanishes mid-conversation (an app server killed by the crash tests) resets its
  // connection; that is the client's problem, never a reason for the fake to stop for everyone.
  smtp.on('error', (err: NodeJS.ErrnoException) =>
    console.warn(`[fakes] mail: a connection failed (${err.code ?? err.message})`),
  );
  smtp.listen(opts.smtpPort, '127.0.0.1');

  // GET /messages[?to=address] newest first; DELETE /messages empties the inbox.
  const inbox = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    res.setHeader('content-type', 'application/json');
    if (url.pathname === '/messages' && req.method === 'GET') {
      const to = url.searchParams.get('to')?.toLowerCase();
      const list = messages
        .filter((m) => !to || m.to.includes(to))
        .slice()
        .reverse();
      res.end(JSON.stringify({ data: list }));
    } else if (url.pathname === '/messages' && req.method === 'DELETE') {
      messages.length = 0;
      persist();
      res.end(JSON.stringify({ data: { deleted: true } }));
    } else if (url.pathname === '/health') {
      res.end(JSON.stringify({ data: { ok: true } }));
    } else {
      res.statusCode = 404;
      res.end(JSON.stringify({ error: { code: 'not_found', message: 'No such path' } }));
    }
  });
  inbox.listen(opts.httpPort, '127.0.0.1');
  return {
    close: () =>
      Promise.all([
        flush(),
        new Promise((r) => smtp.close(() => r(null))),
        new Promise((r) => inbox.close(() => r(null))),
      ]),
  };
}
