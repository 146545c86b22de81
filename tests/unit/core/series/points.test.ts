// Series points and standings (lib/core/series/points.ts). The rule is common practice in motorsport
// series (no single source): points per place from a table, the lowest rounds dropped, a disqualification
// never dropped, points deducted after the drops, ties broken by count-back of places and then the latest
// round. Every expected table below is worked by hand in the comments beside it.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  computeStandings,
  standingsAfterEachRound,
  checkPointsScheme,
  PointsSchemeError,
  type SeriesRound,
} from '../../../../lib/core/series/points';

const scheme = { pointsByPosition: [20, 15, 12, 10, 8], droppedRounds: 1 };
// R1: A 1st, C 2nd, B 3rd, D 4th, E 5th (E has 5 points deducted at this round)
// R2: C 1st, B 2nd, D 3rd, A 4th, E 5th
// R3: B 1st, A 2nd, E 3rd, C 4th, D disqualified
const rounds: SeriesRound[] = [
  {
    roundId: 'r1',
    label: 'Round 1',
    entries: [
      { competitorId: 'A', position: 1 },
      { competitorId: 'C', position: 2 },
      { competitorId: 'B', position: 3 },
      { competitorId: 'D', position: 4 },
      { competitorId: 'E', position: 5, pointsDeducted: 5 },
    ],
  },
  {
    roundId: 'r2',
    label: 'Round 2',
    entries: [
      { competitorId: 'C', position: 1 },
      { competitorId: 'B', position: 2 },
      { competitorId: 'D', position: 3 },
      { competitorId: 'A', position: 4 },
      { competitorId: 'E', position: 5 },
    ],
  },
  {
    roundId: 'r3',
    label: 'Round 3',
    entries: [
      { competitorId: 'B', position: 1 },
      { competitorId: 'A', position: 2 },
      { competitorId: 'E', position: 3 },
      { competitorId: 'C', position: 4 },
      { competitorId: 'D', position: 5, status: 'dsq' },
    ],
  },
];
const table = (rows: ReturnType<typeof computeStandings>) =>
  rows.map((r) => `${r.position} ${r.competitorId} ${r.total}`);

test('after three rounds: one round dropped, a three-way tie broken by count-back and then the latest round', () => {
  // By hand, drop 1 (min(1, 3 - 1) = 1):
  //   A: 20 + 10 + 15 = 45, drops R2's 10 -> 35      C: 15 + 20 + 10 = 45, drops R3's 10 -> 35
  //   B: 12 + 15 + 20 = 47, drops R1's 12 -> 35      E: 8 + 8 + 12 = 28, drops R1's 8 (earliest of equal) -> 20, less 5 -> 15
  //   D: 10 + 12 + 0 (dsq, never dropped) = 22, drops R1's 10 -> 12
  // Tie at 35: first places A 1, B 1, C 1; second places A 1, B 1, C 1; third places B 1, A 0, C 0 -> B first.
  // A against C: fourth places 1 each, no fifths; latest round R3: A 2nd, C 4th -> A second, C third.
  const rows = computeStandings(rounds, scheme);
  assert.deepEqual(table(rows), ['1 B 35', '2 A 35', '3 C 35', '4 E 15', '5 D 12']);
  assert.ok(
    rows.every((r) => !r.isTied),
    'every tie was broken',
  );
  const d = rows.find((r) => r.competitorId === 'D')!;
  assert.deepEqual(
    d.rounds.map((s) => [s.points, s.isDropped, s.status]),
    [
      [10, true, null],
      [12, false, null],
      [0, false, 'dsq'],
    ],
  );
  const e = rows.find((r) => r.competitorId === 'E')!;
  assert.equal(e.grossPoints, 28);
  assert.equal(e.droppedPoints, 8);
  assert.equal(e.pointsDeducted, 5, 'deducted at a dropped round, still taken off');
  assert.deepEqual(
    e.rounds.map((s) => s.isDropped),
    [true, false, false],
  );
});

test('standings after each round: no drop after one round, one drop after two', () => {
  const [after1, after2] = standingsAfterEachRound(rounds, scheme);
  // After R1 nothing is dropped (min(1, 0) = 0): A 20, C 15, B 12, D 10, E 8 - 5 = 3.
  assert.deepEqual(table(after1), ['1 A 20', '2 C 15', '3 B 12', '4 D 10', '5 E 3']);
  // After R2 one drop: A 20 + 10 drops 10 -> 20; C 15 + 20 drops 15 -> 20; B 12 + 15 drops 12 -> 15;
  // D 10 + 12 drops 10 -> 12; E 8 + 8 drops R1's 8 -> 8, less 5 -> 3.
  // A and C tie at 20: one first place each; second places C 1, A 0 -> C ahead.
  assert.deepEqual(table(after2), ['1 C 20', '2 A 20', '3 B 15', '4 D 12', '5 E 3']);
});

test('a tie nothing separates is shared; an absent boat scores nothing that round; places past the table score 0', () => {
  const s = { pointsByPosition: [10, 6], droppedRounds: 0 };
  // R1: P 1st, Q 2nd, Z 3rd (past the table: 0). R2: Q 1st, P 2nd; Z absent.
  // P 10 + 6 = 16, Q 6 + 10 = 16: one first and one second each; latest round R2: Q 1st -> Q ahead.
  const rows = computeStandings(
    [
      {
        roundId: 'a',
        label: 'a',
        entries: [
          { competitorId: 'P', position: 1 },
          { competitorId: 'Q', position: 2 },
          { competitorId: 'Z', position: 3 },
        ],
      },
      {
        roundId: 'b',
        label: 'b',
        entries: [
          { competitorId: 'Q', position: 1 },
          { competitorId: 'P', position: 2 },
        ],
      },
    ],
    s,
  );
  assert.deepEqual(table(rows), ['1 Q 16', '2 P 16', '3 Z 0']);
  assert.equal(rows[2].rounds[1].tookPart, false);
  // Two boats with the same places in one round (a dead heat): nothing separates them, they share 1st.
  const shared = computeStandings(
    [
      {
        roundId: 'a',
        label: 'a',
        entries: [
          { competitorId: 'P', position: 1 },
          { competitorId: 'Q', position: 1 },
        ],
      },
    ],
    s,
  );
  assert.deepEqual(table(shared), ['1 P 10', '1 Q 10']);
  assert.ok(shared.every((r) => r.isTied));
});

test('a points table that is not a table is refused with a clear error', () => {
  for (const bad of [
    { pointsByPosition: [], droppedRounds: 0 },
    { pointsByPosition: [10, 12], droppedRounds: 0 },
    { pointsByPosition: [10, 1.5], droppedRounds: 0 },
    { pointsByPosition: [10, -1], droppedRounds: 0 },
    { pointsByPosition: [10], droppedRounds: -1 },
  ])
    assert.throws(() => checkPointsScheme(bad), PointsSchemeError);
});
