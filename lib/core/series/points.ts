// Series points and standings: framework-free so the rule is unit tested and stated in one place.
// The rule (common practice in motorsport series, no single source; the series' own rules and its
// officials decide, and a series whose rules differ must not rely on this order):
//  1. Each round scores the points of the boat's place in the round's latest results version, from the
//     series class's table (first place scores the first figure; a place past the table scores 0). A boat
//     disqualified from the meeting or excluded scores 0 that round; a boat absent from a round scores 0.
//  2. Dropped rounds: with K dropped rounds, after n rounds the min(K, n - 1) lowest-scoring rounds are
//     left out of the total (ties among equal scores: the earliest round goes first). A round where the
//     boat was disqualified or excluded can never be dropped.
//  3. Points deducted by the stewards (penalties of kind points_deducted in force) are taken off the total
//     after the drops, and are never dropped with a round. A total may go below zero.
//  4. Ties on total are broken by count-back: more first places, then more second places, and so on,
//     over every round held (dropped rounds included); if still equal, the better place in the latest
//     round where the two differ (a boat placed beats one absent or disqualified). Boats still equal
//     share the position.
export const TIE_RULE_TEXT =
  'Ties on points are broken by count-back: more first places, then more second places and so on, over every round held (dropped rounds included); if still equal, the better place in the latest round where they differ. Boats still equal share the position.';
export const DROP_RULE_TEXT =
  'With K dropped rounds, after n rounds the min(K, n - 1) lowest-scoring rounds are left out (the earliest first among equal scores); a round with a disqualification or exclusion is never dropped. Points deducted are taken off after the drops.';

export type RoundStatus = 'dsq' | 'excluded';
export type RoundEntry = {
  competitorId: string; // the boat: one competitor across the season
  position: number; // place in the round's results (classified boats first)
  status?: RoundStatus;
  pointsDeducted?: number; // penalties of kind points_deducted in force for this boat at this round
};
export type SeriesRound = { roundId: string; label: string; entries: readonly RoundEntry[] };
export type PointsScheme = { pointsByPosition: readonly number[]; droppedRounds: number };

export type RoundScore = {
  roundId: string;
  tookPart: boolean;
  position: number | null; // null when absent
  status: RoundStatus | null;
  points: number;
  pointsDeducted: number;
  isDropped: boolean;
};
export type StandingRow = {
  competitorId: string;
  position: number;
  isTied: boolean; // shares its position after every tie-break
  total: number;
  grossPoints: number; // before drops and deductions
  droppedPoints: number;
  pointsDeducted: number;
  rounds: RoundScore[];
};

export class PointsSchemeError extends Error {}

export function checkPointsScheme(scheme: PointsScheme) {
  const t = scheme.pointsByPosition;
  if (t.length < 1 || t.length > 100) throw new PointsSchemeError('A points table has 1 to 100 places.');
  if (t.some((p) => !Number.isInteger(p) || p < 0 || p > 1000))
    throw new PointsSchemeError('Points per place are whole numbers from 0 to 1000.');
  for (let i = 1; i < t.length; i++)
    if (t[i] > t[i - 1]) throw new PointsSchemeError('A lower place may not score more than a higher one.');
  if (!Number.isInteger(scheme.droppedRounds) || scheme.droppedRounds < 0 || scheme.droppedRounds > 20)
    throw new PointsSchemeError('Dropped rounds is a whole number from 0 to 20.');
}

function pointsFor(scheme: PointsScheme, e: RoundEntry | undefined): number {
  if (!e || e.status) return 0;
  return scheme.pointsByPosition[e.position - 1] ?? 0;
}

/** Standings after all the rounds given (in date order). */
export function computeStandings(rounds: readonly SeriesRound[], scheme: PointsScheme): StandingRow[] {
  checkPointsScheme(scheme);
  const ids = [...new Set(rounds.flatMap((r) => r.entries.map((e) => e.competitorId)))];
  const dropCount = Math.max(0, Math.min(scheme.droppedRounds, rounds.length - 1));
  const byRound = rounds.map((r) => new Map(r.entries.map((e) => [e.competitorId, e])));

  const rows = ids.map((competitorId) => {
    const scores: RoundScore[] = rounds.map((r, i) => {
      const e = byRound[i].get(competitorId);
      return {
        roundId: r.roundId,
        tookPart: !!e,
        position: e ? e.position : null,
        status: e?.status ?? null,
        points: pointsFor(scheme, e),
        pointsDeducted: e?.pointsDeducted ?? 0,
        isDropped: false,
      };
    });
    const droppable = scores
      .map((s, i) => ({ s, i }))
      .filter(({ s }) => !s.status)
      .sort((a, b) => a.s.points - b.s.points || a.i - b.i)
      .slice(0, dropCount);
    for (const { s } of droppable) s.isDropped = true;
    const grossPoints = scores.reduce((t, s) => t + s.points, 0);
    const droppedPoints = scores.reduce((t, s) => t + (s.isDropped ? s.points : 0), 0);
    const pointsDeducted = scores.reduce((t, s) => t + s.pointsDeducted, 0);
    return {
      competitorId,
      position: 0,
      isTied: false,
      total: grossPoints - droppedPoints - pointsDeducted,
      grossPoints,
      droppedPoints,
      pointsDeducted,
      rounds: scores,
    };
  });

  const places = (r: StandingRow) => r.rounds.filter((s) => s.position !== null && !s.status).map((s) => s.position!);
  const compare = (a: StandingRow, b: StandingRow) => tieBreak(a, b, places) ?? 0;
  rows.sort((a, b) => b.total - a.total || compare(a, b));
  for (let i = 0; i < rows.length; i++) {
    const prev = rows[i - 1];
    if (prev && prev.total === rows[i].total && compare(prev, rows[i]) === 0) {
      rows[i].position = prev.position;
      rows[i].isTied = prev.isTied = true;
    } else rows[i].position = i + 1;
  }
  return rows;
}

/** Negative when a ranks ahead of b, positive when b does; null when nothing separates them. */
function tieBreak(a: StandingRow, b: StandingRow, places: (r: StandingRow) => number[]): number | null {
  const pa = places(a);
  const pb = places(b);
  const deepest = Math.max(0, ...pa, ...pb);
  for (let place = 1; place <= deepest; place++) {
    const d = pb.filter((p) => p === place).length - pa.filter((p) => p === place).length;
    if (d !== 0) return d;
  }
  for (let i = a.rounds.length - 1; i >= 0; i--) {
    const ra = a.rounds[i];
    const rb = b.rounds[i];
    const qa = ra.position !== null && !ra.status ? ra.position : Infinity;
    const qb = rb.position !== null && !rb.status ? rb.position : Infinity;
    if (qa !== qb) return qa < qb ? -1 : 1;
  }
  return null;
}

/** Standings after each round: element i is the table after rounds 0..i. */
export function standingsAfterEachRound(rounds: readonly SeriesRound[], scheme: PointsScheme): StandingRow[][] {
  return rounds.map((_, i) => computeStandings(rounds.slice(0, i + 1), scheme));
}
