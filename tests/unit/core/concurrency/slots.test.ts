// Slots (lib/core/concurrency/slots.ts): a counting semaphore as Dijkstra described it (E. W. Dijkstra,
// "Cooperating sequential processes", EWD 123, 1965: P waits while the count is zero, V gives a unit back), with
// waiters served first come, first served.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { createSlots } from '../../../../lib/core/concurrency/slots';

const tick = () => new Promise((r) => setImmediate(r));

test('never more than the size at once; every piece of work runs; waiters go in the order they came', async () => {
  const slots = createSlots(2);
  let now = 0;
  let most = 0;
  const started: number[] = [];
  const gates: (() => void)[] = [];
  const all = Array.from({ length: 7 }, (_, i) =>
    slots.run(async () => {
      started.push(i);
      now++;
      most = Math.max(most, now);
      await new Promise<void>((r) => gates.push(r));
      now--;
      return i * 10;
    }),
  );
  await tick();
  assert.equal(slots.running, 2);
  assert.equal(slots.waiting, 5);
  while (gates.length > 0 || started.length < 7) {
    gates.shift()?.();
    await tick();
    await tick();
  }
  assert.deepEqual(await Promise.all(all), [0, 10, 20, 30, 40, 50, 60]);
  assert.equal(most, 2);
  assert.deepEqual(started, [0, 1, 2, 3, 4, 5, 6]);
  assert.equal(slots.running, 0);
  assert.equal(slots.waiting, 0);
});

test('a failure gives its slot back and reaches its own caller only', async () => {
  const slots = createSlots(1);
  const failed = slots.run(async () => {
    throw new Error('hash failed');
  });
  const next = slots.run(async () => 'ran');
  await assert.rejects(failed, /hash failed/);
  assert.equal(await next, 'ran');
  assert.equal(slots.running, 0);
});

test('a size that is not a whole number from 1 is refused', () => {
  for (const bad of [0, -1, 1.5, Number.NaN]) assert.throws(() => createSlots(bad), RangeError);
});
