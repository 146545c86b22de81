// Parity history of a series class: each round's published parity figures side by side, so a committee
// sees whether a rule change narrowed the field. Framework-free (unit tested against simple-statistics).
// The definitions are the parity report's own (lib/core/engine/parity.ts), so a round reads as its report:
//  - spread = (max - min) / median of the static thrusts, in per cent;
//  - coefficient of variation = sample standard deviation (n - 1 in the denominator) / mean, in per cent
//    (null for fewer than two boats);
//  - a boat's deviation = (its static thrust - the round's median) / median, in per cent.
// A rule change (a series rule version) is placed between the last round before its effective date and
// the first round on or after it.
import { mean as meanOf, sampleStandardDeviation } from '../stats/correlation';

export type ParityRoundInput = {
  roundId: string;
  label: string;
  date: string; // the meeting's first day, YYYY-MM-DD
  boats: readonly { competitorId: string; label: string; staticThrustN: number }[];
};
export type RuleChange = { version: number; effectiveFrom: string; note: string };

export type ParityRoundFigures = {
  roundId: string;
  label: string;
  date: string;
  boatCount: number;
  medianN: number;
  meanN: number;
  sampleStandardDeviationN: number | null;
  spreadPercent: number;
  coefficientOfVariationPercent: number | null;
  deviationsPercent: Record<string, number>; // by competitor
};
export type ParityHistory = {
  rounds: ParityRoundFigures[];
  competitors: { competitorId: string; label: string }[];
  // afterRoundIndex: the change took effect after this round (-1: before the first round shown)
  ruleChanges: (RuleChange & { afterRoundIndex: number })[];
};

export function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

export function roundFigures(input: ParityRoundInput): ParityRoundFigures | null {
  const t = input.boats.map((b) => b.staticThrustN);
  if (!t.length) return null;
  const n = t.length;
  const mean = meanOf(t);
  const med = median(t);
  const sd = n < 2 ? null : sampleStandardDeviation(t);
  return {
    roundId: input.roundId,
    label: input.label,
    date: input.date,
    boatCount: n,
    medianN: med,
    meanN: mean,
    sampleStandardDeviationN: sd,
    spreadPercent: ((Math.max(...t) - Math.min(...t)) / med) * 100,
    coefficientOfVariationPercent: sd === null ? null : (sd / mean) * 100,
    deviationsPercent: Object.fromEntries(
      input.boats.map((b) => [b.competitorId, ((b.staticThrustN - med) / med) * 100]),
    ),
  };
}

export function buildParityHistory(rounds: readonly ParityRoundInput[], changes: readonly RuleChange[]): ParityHistory {
  const sorted = [...rounds].sort((a, b) => a.date.localeCompare(b.date) || a.label.localeCompare(b.label));
  const figures = sorted.map(roundFigures).filter((f): f is ParityRoundFigures => f !== null);
  const competitors = new Map<string, string>();
  for (const r of sorted)
    for (const b of r.boats) if (!competitors.has(b.competitorId)) competitors.set(b.competitorId, b.label);
  const ruleChanges = [...changes]
    .sort((a, b) => a.effectiveFrom.localeCompare(b.effectiveFrom) || a.version - b.version)
    .map((c) => {
      const firstOnOrAfter = figures.findIndex((f) => f.date >= c.effectiveFrom);
      return { ...c, afterRoundIndex: (firstOnOrAfter === -1 ? figures.length : firstOnOrAfter) - 1 };
    });
  return {
    rounds: figures,
    competitors: [...competitors].map(([competitorId, label]) => ({ competitorId, label })),
    ruleChanges,
  };
}
