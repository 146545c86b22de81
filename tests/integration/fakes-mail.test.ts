// The mail fake keeps answering when a client vanishes mid-conversation (an app server killed by the
// crash tests resets its pooled SMTP connections): a reset connection is that client's problem only.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { connect } from 'node:net';
import { MAIL_INBOX } from '../support/env';

test('a connection reset in the middle of an SMTP conversation does not stop the mail fake', async () => {
  const port = Number(new URL(process.env.SMTP_URL!).port);
  await new Promise<void>((resolve, reject) => {
    const socket = connect(port, '127.0.0.1');
    socket.once('error', reject);
    let replies = 0;
    socket.on('data', () => {
      replies++;
      if (replies === 1) socket.write('EHLO reset.test\r\n');
      else if (replies === 2) socket.write('MAIL FROM:<no-reply@boreline.invalid>\r\n');
      // In the middle of a message, as when an app server is killed while sending: then an RST
      // instead of a FIN, as the kernel sends for a killed process's socket.
      else if (replies === 3)
        setTimeout(() => {
          socket.resetAndDestroy();
          resolve();
        }, 50);
    });
  });
  await new Promise((r) => setTimeout(r, 300));
  const res = await fetch(MAIL_INBOX);
  assert.equal(res.status, 200, 'the inbox still answers');
  await res.arrayBuffer();
  // And the SMTP side still greets a new client.
  const banner = await new Promise<string>((resolve, reject) => {
    const socket = connect(port, '127.0.0.1');
    socket.once('error', reject);
    socket.once('data', (d) => {
      socket.end('QUIT\r\n');
      resolve(String(d));
    });
  });
  assert.match(banner, /^220 /);
});
