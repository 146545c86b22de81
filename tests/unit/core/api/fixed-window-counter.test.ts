// The public API's rate limit while the database cannot count: fixed one-minute windows kept in the
// app server's memory, the same limit per client, never unlimited (common practice for a fallback
// limiter, no source: the fixed-window counter is the one the database keeps too).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { createFixedWindowCounter } from '../../../../lib/core/api/fixed-window-counter';

const recordAttemptInMemory = createFixedWindowCounter({ windowS: 60, maxKeys: 10_000 });

test('the limit holds within a window, a new window starts afresh, clients are counted apart', () => {
  const t0 = 1_000_000;
  const key = `rate:test:${Math.random()}`;
  for (let i = 1; i <= 3; i++) assert.equal(recordAttemptInMemory(key, 3, t0 + i).allowed, true, `attempt ${i}`);
  const over = recordAttemptInMemory(key, 3, t0 + 10_000);
  assert.equal(over.allowed, false);
  assert.equal(over.retryAfterS, 51, 'the window opened at t0 + 1 ms and lasts 60 s: 50.001 s left, rounded up');
  assert.equal(recordAttemptInMemory(`${key}:other`, 3, t0 + 10_000).allowed, true, 'another client');
  assert.equal(recordAttemptInMemory(key, 3, t0 + 60_001).allowed, true, 'the next window');
});

test('memory stays bounded: past 10,000 clients the expired windows, then the oldest, give way', () => {
  const t0 = 5_000_000;
  for (let i = 0; i < 10_050; i++) recordAttemptInMemory(`rate:flood:${i}`, 1, t0);
  // The first client's window was dropped to make room: it is counted afresh (allowed), not refused.
  assert.equal(recordAttemptInMemory('rate:flood:0', 1, t0 + 1).allowed, true);
  // A recent client is still held: its second attempt in the window is refused.
  assert.equal(recordAttemptInMemory('rate:flood:10049', 1, t0 + 1).allowed, false);
});
