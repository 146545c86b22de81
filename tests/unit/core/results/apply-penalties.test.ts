// Results amended by penalties, worked by hand. The order of application (time penalties re-rank by best
// run plus time added, then places deducted, then disqualified and excluded boats listed after the
// classification) is common practice in motorsport codes, no single source; each expected order below is
// worked out by hand in the comment beside it. Boats and times are invented.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  applyPenalties,
  PenaltyApplicationError,
  type BaseRow,
  type PenaltyInForce,
  type RunTimeOf,
} from '../../../../lib/core/results/apply-penalties';
import { diffResultsRows } from '../../../../lib/core/results/diff-results-rows';

const base: BaseRow[] = [
  { position: 1, raceNumber: 11, entryId: 'a' },
  { position: 2, raceNumber: 22, entryId: 'b' },
  { position: 3, raceNumber: 33, entryId: 'c' },
  { position: 4, raceNumber: 44, entryId: 'd' },
];
const at = (min: number) => new Date(Date.UTC(2027, 2, 13, 3, min));
const pen = (p: Partial<PenaltyInForce> & Pick<PenaltyInForce, 'entryId' | 'kind'>, min = 0): PenaltyInForce => ({
  id: `p-${p.entryId}-${p.kind}-${min}`,
  amount: null,
  runLabel: null,
  decidedAt: at(min),
  ...p,
});
const order = (rows: { raceNumber: number; status?: string }[]) =>
  rows.map((r) => `${r.raceNumber}${r.status ? `:${r.status}` : ''}`);
const noRuns = new Map<string, RunTimeOf[]>();

test('no penalties: the base order, renumbered 1..n', () => {
  assert.deepEqual(order(applyPenalties(base, [], noRuns)), ['11', '22', '33', '44']);
});

test('three places deducted from the winner: it drops to 4th and the others move up one (hand-worked)', () => {
  const rows = applyPenalties(base, [pen({ entryId: 'a', kind: 'places_deducted', amount: 3 })], noRuns);
  assert.deepEqual(order(rows), ['22', '33', '44', '11']);
  assert.deepEqual(
    rows.map((r) => r.position),
    [1, 2, 3, 4],
  );
});

test('places deducted never push a boat past the last classified place', () => {
  const rows = applyPenalties(base, [pen({ entryId: 'c', kind: 'places_deducted', amount: 10 })], noRuns);
  assert.deepEqual(order(rows), ['11', '22', '44', '33']);
});

test('disqualification and exclusion leave the classification and are listed after it, in base order', () => {
  const rows = applyPenalties(
    base,
    [pen({ entryId: 'b', kind: 'exclusion' }), pen({ entryId: 'a', kind: 'meeting_disqualification' }, 1)],
    noRuns,
  );
  // Classified: c, d (positions 1, 2); then a (dsq) and b (excluded) in base order: positions 3, 4.
  assert.deepEqual(order(rows), ['33', '44', '11:dsq', '22:excluded']);
  assert.deepEqual(
    rows.map((r) => r.position),
    [1, 2, 3, 4],
  );
});

test('points deducted, fines and warnings leave the order as it is', () => {
  const rows = applyPenalties(
    base,
    [
      pen({ entryId: 'a', kind: 'points_deducted', amount: 5 }),
      pen({ entryId: 'b', kind: 'fine', amount: 20000 }),
      pen({ entryId: 'c', kind: 'warning' }),
    ],
    noRuns,
  );
  assert.deepEqual(order(rows), ['11', '22', '33', '44']);
});

test('time added re-ranks by best run plus the penalty (hand-worked)', () => {
  // Best runs: a 20.10, b 20.40, c 20.90, d 21.50 s. a gets +1 s: 21.10 s, between c (20.90) and d (21.50).
  const runs = new Map<string, RunTimeOf[]>([
    [
      'a',
      [
        { runLabel: 'R1', elapsedS: 20.1 },
        { runLabel: 'R2', elapsedS: 20.6 },
      ],
    ],
    ['b', [{ runLabel: 'R1', elapsedS: 20.4 }]],
    ['c', [{ runLabel: 'R1', elapsedS: 20.9 }]],
    ['d', [{ runLabel: 'R1', elapsedS: 21.5 }]],
  ]);
  assert.deepEqual(order(applyPenalties(base, [pen({ entryId: 'a', kind: 'time_added', amount: 1 })], runs)), [
    '22',
    '33',
    '11',
    '44',
  ]);
  // A run struck out: a's best becomes its other run, 20.60 s, behind b (20.40) and ahead of c (20.90).
  assert.deepEqual(
    order(applyPenalties(base, [pen({ entryId: 'a', kind: 'run_disqualification', runLabel: 'R1' })], runs)),
    ['22', '11', '33', '44'],
  );
  // b's only run struck out: b has no time left and is disqualified from the results.
  assert.deepEqual(
    order(applyPenalties(base, [pen({ entryId: 'b', kind: 'run_disqualification', runLabel: 'R1' })], runs)),
    ['11', '33', '44', '22:dsq'],
  );
});

test('a time penalty with a classified boat that has no run time is refused, naming the boat', () => {
  const runs = new Map<string, RunTimeOf[]>([
    ['a', [{ runLabel: 'R1', elapsedS: 20.1 }]],
    ['b', [{ runLabel: 'R1', elapsedS: 20.4 }]],
    ['c', [{ runLabel: 'R1', elapsedS: 20.9 }]],
  ]);
  assert.throws(
    () => applyPenalties(base, [pen({ entryId: 'a', kind: 'time_added', amount: 2 })], runs),
    (err: unknown) =>
      err instanceof PenaltyApplicationError && err.raceNumbers.join() === '44' && /#44/.test(err.message),
  );
});

test('penalties apply in the order decided; a penalty on a boat not in the results is ignored here', () => {
  // Decided first: a loses one place (b a c d); then b loses two (a c b d).
  const rows = applyPenalties(
    base,
    [
      pen({ entryId: 'b', kind: 'places_deducted', amount: 2 }, 5),
      pen({ entryId: 'a', kind: 'places_deducted', amount: 1 }, 1),
      pen({ entryId: 'zz', kind: 'exclusion' }, 2),
    ],
    noRuns,
  );
  assert.deepEqual(order(rows), ['11', '33', '22', '44']);
});

test('restoring: with the annulled penalty gone the order is the base again and the diff names the boats that move back', () => {
  const amended = applyPenalties(base, [pen({ entryId: 'a', kind: 'places_deducted', amount: 3 })], noRuns);
  const restored = applyPenalties(base, [], noRuns);
  assert.deepEqual(restored, base);
  assert.deepEqual(diffResultsRows(amended, restored), ['a', 'b', 'c', 'd']);
  // A status change alone is a change too.
  const dsq = applyPenalties(base, [pen({ entryId: 'd', kind: 'meeting_disqualification' })], noRuns);
  assert.deepEqual(diffResultsRows(base, dsq), ['d']);
});
