// The predicted-time section of a published parity report as plain lines (the PDF draws them; the CSV takes the
// per-boat cells from clockCsvCells). Framework-free. The figures come from results.clock, stored with the report.

import type { ClockSection } from '../timing/clock-section';

export type ClockReportLine = { text: string; heading?: boolean };

const f = (v: number | null, d = 2) => (v === null || !Number.isFinite(v) ? '—' : v.toFixed(d));
const DRAG_WORDS = {
  trap_speed: 'trap speed',
  gps_top_speed: 'GPS top speed',
  class_default: 'class default',
} as const;

/** The thrust model a boat's prediction used, in words (a section stored before the word: fixed power). */
export function thrustModelWord(b: { thrustModel?: 'fixed_power' | 'matched' }): string {
  return b.thrustModel === 'matched' ? 'matched' : 'fixed power';
}

/** What the mass adds to the weight, in words: sections stored before declarations assumed crew and fuel for every boat. */
export function massWords(clock: Pick<ClockSection, 'assumptions' | 'boats'>): string {
  const A = clock.assumptions;
  return clock.boats.some((b) => b.crewSource !== undefined)
    ? `the crew and fuel the entrant declared for the entry, else ${A.crewKg} kg crew and ${A.fuelKg} kg fuel, assumed (common practice, no source); each boat's mass says which`
    : `${A.crewKg} kg crew and ${A.fuelKg} kg fuel, assumed (common practice, no source)`;
}

/** The section's lines: assumptions with their sources, one line per boat, the class comparison, the caution. */
export function clockReportLines(clock: ClockSection | null | undefined): ClockReportLine[] {
  if (!clock) return [];
  const A = clock.assumptions;
  const c = clock.comparison;
  const distances = [
    ...A.referenceDistancesM.map((d) => `${d} m`),
    ...(clock.courseLengthM ? [`${clock.courseLengthM} m`] : []),
  ];
  const lines: ClockReportLine[] = [
    { text: 'Predicted time over a course, and the model against the clock', heading: true },
    {
      text: `Each boat from rest on a straight line: m·dV/dt = T(V) − k·V², T(V) the boat's thrust on the class's report model (matched where the class reports on it and the boat's inspected declaration holds both curves, its engine curve levelled to the confirmed power; else fixed power; each boat's line says which), integrated by the classical fourth-order Runge–Kutta method with a step-halving check (Butcher, Numerical Methods for Ordinary Differential Equations, 2016; Press et al., Numerical Recipes, 2007); worst relative accuracy reached ${clock.worstRelativeAccuracy === null ? '—' : clock.worstRelativeAccuracy.toExponential(1)}. Mass: the weight measured at inspection (else the class minimum) plus ${massWords(clock)}. Drag k: fitted so that thrust equals drag at the boat's own top speed (GPS, else trap), else the class median of the fitted values, else an assumed ${(A.assumedTopSpeedMs * 3.6).toFixed(0)} km/h top speed. Turns, starts and driving are not modelled. U is expanded (k = 2) from power, nozzle and weighing uncertainties (JCGM 100:2008).`,
    },
  ];
  for (const b of clock.boats) {
    const times = [...b.referenceTimesS, ...(clock.courseLengthM ? [b.courseTimeS] : [])]
      .map((t, i) => `${distances[i]} ${f(t)} s`)
      .join(', ');
    const u = b.uTimeS !== null && b.uTimeS > 0 ? ` (U ${f(2 * b.uTimeS)} s)` : '';
    const observed = b.observedS.length ? `; observed ${b.observedS.map((t) => f(t)).join(', ')} s` : '';
    const model = `Thrust: ${thrustModelWord(b)}${b.thrustModelReason ? ` (${b.thrustModelReason})` : ''}.`;
    lines.push({
      text: b.note
        ? `#${b.raceNumber} ${b.boatName}: ${b.note}. Mass ${b.massBasis}. ${model}`
        : `#${b.raceNumber} ${b.boatName}: ${times}${u}; top speed ${f(b.topSpeedMs === null ? null : b.topSpeedMs * 3.6, 1)} km/h; thrust/weight ${f(b.thrustToWeight)}; ${f(b.powerToWeightKwPerT, 0)} kW/t. Mass ${b.massBasis}. Drag: ${b.dragBasis ? DRAG_WORDS[b.dragBasis] : '—'}, ${b.dragNote}${observed}. ${model}`,
    });
  }
  lines.push({ text: 'Predicted against observed', heading: true });
  if (c.points.length >= 3)
    lines.push({
      text: `${c.points.length} boats${clock.courseLengthM ? ` over ${clock.courseLengthM} m` : ''}: Pearson r ${f(c.pearson)}, Spearman rank ${f(c.spearman)} (|r| below ${f(c.criticalR)} is not told apart from none, 5 %); residual observed − predicted mean ${f(c.meanResidualS)} s, SD ${f(c.residualSpreadS)} s; run-to-run SD ${f(c.pooledRunSpreadS)} s; smallest difference the clock tells apart ${f(c.smallestDifferenceS)} s (Pearson and Spearman correlation; Fisher's least significant difference, Montgomery, Design and Analysis of Experiments, 2013).`,
    });
  for (const n of c.notes) lines.push({ text: n });
  lines.push({
    text: "Caution: a prediction from a model, not a result or a verdict. The governing body's rules and its officials decide.",
  });
  return lines;
}

export const CLOCK_CSV_COLUMNS = [
  'predicted_100_m_s',
  'predicted_200_m_s',
  'predicted_course_s',
  'course_m',
  'u_predicted_time_s',
  'predicted_top_speed_ms',
  'thrust_to_weight',
  'power_to_weight_kw_per_t',
  'mass_kg',
  'mass_basis',
  'drag_basis',
  'observed_runs_s',
  'predicted_time_thrust_model',
] as const;

/** One boat's predicted-time cells, in CLOCK_CSV_COLUMNS order; empty cells when the report has no clock section. */
export function clockCsvCells(clock: ClockSection | null | undefined, entryId: string): unknown[] {
  const b = clock?.boats.find((x) => x.entryId === entryId);
  if (!clock || !b) return CLOCK_CSV_COLUMNS.map(() => '');
  const at = (d: number) => {
    const i = clock.assumptions.referenceDistancesM.indexOf(d as 100 | 200);
    return i < 0 ? '' : (b.referenceTimesS[i] ?? '');
  };
  return [
    at(100),
    at(200),
    b.courseTimeS ?? '',
    clock.courseLengthM ?? '',
    b.uTimeS ?? '',
    b.topSpeedMs ?? '',
    b.thrustToWeight ?? '',
    b.powerToWeightKwPerT ?? '',
    b.massKg ?? '',
    b.massBasis,
    b.dragBasis ?? '',
    b.observedS.join(' '),
    b.thrustModel ?? 'fixed_power',
  ];
}
