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

  // Addresses the fake refuses for their next N deliveries (POST /refuse): a relay that is briefly
  // unable to take mail for one recipient, so a test can watch the sender retry without stopping the
  // fake for everyone else. 451 is a transient failure (RFC 5321, section 4.2.3).
  const refusals = new Map<string, number>();
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    banner: 'boreline mail fake',
    onRcptTo(address, _session, callback) {
      const to = address.address.toLowerCase();
      const left = refusals.get(to) ?? 0;
      if (left > 0) {
        if (left === 1) refusals.delete(to);
        else refusals.set(to, left - 1);
        const err = new Error('Requested action aborted: local error in processing (fake)') as Error & {
          responseCode: number;
        };
        err.responseCode = 451;
        return callback(err);
      }
      callback();
    },
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

  // GET /messages[?to=address] newest first; DELETE /messages empties the inbox; POST
  // /refuse?to=address&times=N refuses that address's next N deliveries.
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
    } else if (url.pathname === '/refuse' && req.method === 'POST') {
      const to = url.searchParams.get('to')?.toLowerCase() ?? '';
      const times = Number(url.searchParams.get('times') ?? 1);
      if (!to || !Number.isInteger(times) || times < 1 || times > 100) {
        res.statusCode = 400;
        res.end(JSON.stringify({ error: { code: 'invalid_input', message: 'Give to= and times= (1 to 100)' } }));
        return;
      }
      refusals.set(to, times);
      res.end(JSON.stringify({ data: { to, times } }));
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
