// Two writers crossing in PostgreSQL (deadlock_detected 40P01, serialization_failure 40001: the SQLSTATE
// codes of PostgreSQL's documentation, Appendix A "PostgreSQL Error Codes") are answered as a conflict to
// send again (409 with Retry-After), never as "something went wrong" (500).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { isCrossedWrite, toErrorResponse } from '../../../../lib/core/errors';

test('a deadlock or a serialization failure is a 409 to resend, with the one error shape', async () => {
  for (const code of ['40P01', '40001']) {
    // As Sequelize wraps a driver error: name, message, and the driver's error under parent and original.
    const err = Object.assign(new Error('deadlock detected'), {
      name: 'SequelizeDatabaseError',
      parent: { code },
      original: { code },
    });
    assert.equal(isCrossedWrite(err), true);
    const res = toErrorResponse(err, { requestId: 'r-1', onUnexpected: () => assert.fail('not unexpected') });
    assert.equal(res.status, 409);
    assert.equal(res.headers.get('retry-after'), '1');
    const body = await res.json();
    assert.equal(body.error.code, 'crossed_write');
    assert.equal(body.error.requestId, 'r-1');
  }
  assert.equal(isCrossedWrite(Object.assign(new Error('x'), { parent: { code: '23505' } })), false);
  assert.equal(isCrossedWrite(null), false);
});
