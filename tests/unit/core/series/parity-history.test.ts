// Parity history of a series class (lib/core/series/parity-history.ts): spread = (max - min) / median and
// coefficient of variation = sample standard deviation (n - 1) / mean, as the parity report defines them.
// Checked against simple-statistics 7.12.1 (an independent implementation: median, mean,
// sampleStandardDeviation) and one round worked by hand.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import * as ss from 'simple-statistics';
import { buildParityHistory, roundFigures } from '../../../../lib/core/series/parity-history';

const boats = (...t: number[]) => t.map((x, i) => ({ competitorId: `b${i}`, label: `#${i + 1}`, staticThrustN: x }));

test('one round by hand: 4000, 4200, 4400 N', () => {
  // median 4200; spread (4400 - 4000) / 4200 = 9.5238 %; mean 4200;
  // sample SD sqrt((200² + 0 + 200²) / 2) = 200 N; CV 200 / 4200 = 4.7619 %; deviations -4.7619, 0, +4.7619 %.
  const f = roundFigures({ roundId: 'r', label: 'R', date: '2027-01-10', boats: boats(4000, 4200, 4400) })!;
  assert.ok(Math.abs(f.spreadPercent - 9.5238) < 1e-4);
  assert.ok(Math.abs(f.sampleStandardDeviationN! - 200) < 1e-9);
  assert.ok(Math.abs(f.coefficientOfVariationPercent! - 4.7619) < 1e-4);
  assert.ok(Math.abs(f.deviationsPercent.b0 + 4.7619) < 1e-4);
  assert.equal(f.deviationsPercent.b1, 0);
});

test('three rounds with a rule change between the second and third, against simple-statistics', () => {
  const r = [
    { roundId: 'r1', label: 'R1', date: '2027-01-10', boats: boats(3810, 4120, 4390, 4655) },
    { roundId: 'r3', label: 'R3', date: '2027-03-07', boats: boats(4010, 4105, 4170, 4230) },
    { roundId: 'r2', label: 'R2', date: '2027-02-14', boats: boats(3790, 4150, 4400, 4690, 4020) },
  ];
  const h = buildParityHistory(r, [{ version: 2, effectiveFrom: '2027-03-01', note: 'nozzle 101 mm max' }]);
  assert.deepEqual(
    h.rounds.map((x) => x.roundId),
    ['r1', 'r2', 'r3'],
    'date order',
  );
  for (const f of h.rounds) {
    const t = r.find((x) => x.roundId === f.roundId)!.boats.map((b) => b.staticThrustN);
    const med = ss.median(t);
    assert.ok(Math.abs(f.spreadPercent - ((ss.max(t) - ss.min(t)) / med) * 100) < 1e-9);
    assert.ok(Math.abs(f.coefficientOfVariationPercent! - (ss.sampleStandardDeviation(t) / ss.mean(t)) * 100) < 1e-9);
    for (const [i, x] of t.entries())
      assert.ok(Math.abs(f.deviationsPercent[`b${i}`] - ((x - med) / med) * 100) < 1e-9);
  }
  assert.equal(h.ruleChanges[0].afterRoundIndex, 1, 'marked between R2 and R3');
  assert.ok(h.rounds[2].coefficientOfVariationPercent! < h.rounds[1].coefficientOfVariationPercent!);
  assert.equal(h.competitors.length, 5);
  // One boat: no SD, no CV.
  assert.equal(
    roundFigures({ roundId: 'x', label: 'x', date: '2027-01-01', boats: boats(4000) })!.coefficientOfVariationPercent,
    null,
  );
});
