// The verdict felt at the dock: each overall result has its own number of pulses, and its tones follow the same
// count. Telling haptic signals apart by their count of pulses rather than by their length or strength is common
// practice, no source. The Vibration API (W3C Vibration API, "vibrate() method") takes a pattern of alternating
// on and off durations in ms, on first; a pattern that ends on a pause has a useless last entry.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  pulseCount,
  signalFor,
  VERDICT_SIGNALS,
  type SignalledVerdict,
} from '../../../../app/(app)/inspect/[eventId]/verdict-signal';

const VERDICTS: SignalledVerdict[] = ['conforms', 'inconclusive', 'does_not_conform'];

test('one pulse conforms, two inconclusive, three does not conform; the tones keep the count', () => {
  const counts = VERDICTS.map((v) => pulseCount(VERDICT_SIGNALS[v].vibrateMs));
  assert.deepEqual(counts, [1, 2, 3]);
  for (const v of VERDICTS) assert.equal(VERDICT_SIGNALS[v].tones.length, pulseCount(VERDICT_SIGNALS[v].vibrateMs), v);
});

test('each pattern is on-off-...-on with positive durations, and short enough not to hold up the next boat', () => {
  for (const v of VERDICTS) {
    const p = VERDICT_SIGNALS[v].vibrateMs;
    assert.equal(p.length % 2, 1, `${v}: ends on a pulse`);
    assert.ok(
      p.every((ms) => Number.isInteger(ms) && ms > 0),
      v,
    );
    const totalMs = p.reduce((a, b) => a + b, 0);
    assert.ok(totalMs <= 2000, `${v}: ${totalMs} ms`);
    const toneMs = VERDICT_SIGNALS[v].tones.reduce((a, t) => a + t.ms + t.gapMs, 0);
    assert.ok(toneMs <= 2000, `${v}: tones ${toneMs} ms`);
  }
});

test('nothing for a record the server has not decided yet, or an unknown word', () => {
  assert.equal(signalFor('pending'), null);
  assert.equal(signalFor('toString'), null, 'not a property inherited from Object');
  assert.equal(signalFor('conforms'), VERDICT_SIGNALS.conforms);
});
