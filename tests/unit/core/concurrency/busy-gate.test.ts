// The busy gate that background workers (mail outbox, record chain) ask before each tick. No published
// source: holding back deferrable work while a server is busy, with a bound on the wait, is common practice.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { createBusyGate } from '../../../../lib/core/concurrency/busy-gate';

test('an idle server never holds the work back', () => {
  const gate = createBusyGate(() => 1000);
  for (const now of [0, 10, 5000]) assert.equal(gate.shouldWait(0, now), false);
});

test('a busy server holds it back until the bound, then lets it run', () => {
  const gate = createBusyGate(() => 1000);
  assert.equal(gate.shouldWait(3, 100), true, 'first busy tick: the clock starts');
  assert.equal(gate.shouldWait(1, 600), true);
  assert.equal(gate.shouldWait(5, 1099), true, '999 ms after the first busy tick');
  assert.equal(gate.shouldWait(5, 1100), false, '1000 ms: the work runs although the server is still busy');
  // The clock starts again: a busy server after the run holds the next tick back for another full bound.
  assert.equal(gate.shouldWait(5, 1200), true);
  assert.equal(gate.shouldWait(5, 2199), true);
  assert.equal(gate.shouldWait(5, 2200), false);
});

test('an idle tick in between restarts the clock', () => {
  const gate = createBusyGate(() => 1000);
  assert.equal(gate.shouldWait(2, 0), true);
  assert.equal(gate.shouldWait(0, 900), false, 'idle: runs at once');
  assert.equal(gate.shouldWait(2, 950), true, 'busy again: a new clock, not the one from 0 ms');
  assert.equal(gate.shouldWait(2, 1900), true);
  assert.equal(gate.shouldWait(2, 1950), false);
});

test('the bound is read on every tick (a setting read lazily)', () => {
  let bound = 1000;
  const gate = createBusyGate(() => bound);
  assert.equal(gate.shouldWait(1, 0), true);
  bound = 100;
  assert.equal(gate.shouldWait(1, 150), false);
});
