// A request the server is still answering for as long as a test wants: a sign-up whose chunked body does not end.
// Background workers that hold back while requests are in flight (lib/core/concurrency/busy-gate.ts) see the
// server busy the whole time.
import http from 'node:http';
import { BASE_URL } from './env';

/** Opens the request; `finish()` ends its body (without the fields, so it is refused 400) and gives the status. */
export function holdRequestOpen(): { heldAt: number; finish(): Promise<number> } {
  const held = http.request(new URL('/api/accounts', BASE_URL), {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'transfer-encoding': 'chunked' },
  });
  const answered = new Promise<number>((resolve, reject) => {
    held.on('response', (r) => r.resume().on('end', () => resolve(r.statusCode ?? 0)));
    held.on('error', reject);
  });
  held.write('{"name": "Held Open');
  return {
    heldAt: Date.now(),
    finish() {
      held.end('"}');
      return answered;
    },
  };
}
