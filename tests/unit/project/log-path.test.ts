// The access log's path: a bearer token in an address (an invitation, an address proof, a boat tag) never reaches
// the log. OWASP ASVS 5.0 (from memory, chapter on security logging): logs must not hold secrets such as session
// identifiers or tokens; OWASP Logging Cheat Sheet, "Data to exclude": access tokens.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { logPath } from '../../../scripts/observability.mjs';

const TOKEN = 'Xq3v_9k2LmN0pQrStUvWxYz0123456789abcdEFGHij';

test('tokens in addresses are logged as :token, the rest of the path kept', () => {
  assert.equal(logPath(`/invite/${TOKEN}`), '/invite/:token');
  assert.equal(logPath(`/confirm-address/${TOKEN}?x=1`), '/confirm-address/:token');
  assert.equal(logPath(`/t/${TOKEN}`), '/t/:token');
  assert.equal(
    logPath(`/api/events/0b0e0000-0000-4000-8000-000000000101/tags/${TOKEN}`),
    '/api/events/0b0e0000-0000-4000-8000-000000000101/tags/:token',
  );
  assert.equal(logPath(`/invite/${TOKEN}/more`), '/invite/:token/more');
});

test('other paths are logged as they are, without the query', () => {
  assert.equal(
    logPath('/inspect/0b0e0000-0000-4000-8000-000000000101?race=12'),
    '/inspect/0b0e0000-0000-4000-8000-000000000101',
  );
  assert.equal(logPath('/api/health'), '/api/health');
  assert.equal(logPath('/invite'), '/invite');
  assert.equal(logPath('/tags/abc'), '/tags/abc');
  assert.equal(logPath(undefined), '/');
});
