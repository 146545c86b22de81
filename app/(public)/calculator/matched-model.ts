// The matched mode's form as typed (text), turned into the matched body, checked with the same
// schema the public route uses, and computed in the browser by the engine's pure function.
// Every refusal comes back as a message keyed by the field it names, so the form can show it
// beside that field; nothing here throws.
// Plain TypeScript: no React.

import { computeJetPerformance, computeMatchedPerformance } from '@/lib/core/engine/calculation-api';
import type { MatchedPerformanceInput, MatchedPerformancePoint } from '@/lib/core/engine/calculation-api';
import { EngineInputError, EngineOperatingPointError } from '@/lib/core/engine/engine-input-error';
import { matchedInputSchema } from '@/lib/core/inputs/calculation';

/** The sweep: 0 to 40 m/s in 0.5 m/s steps. */
export const MATCHED_SPEEDS_MS = Array.from({ length: 81 }, (_, i) => i * 0.5);
/** The rows of the table. */
export const MATCHED_REFERENCE_SPEEDS_MS = [0, 10, 20, 30, 40] as const;
export const MAX_CURVE_ROWS = 16;
/** The words on the chart's shaded region and in the sentence beside it. */
export const CAVITATION_WORDS = 'cavitating: the thrust is an upper bound';

export interface EngineRow {
  key: string;
  rpm: string;
  powerKw: string;
}

export interface PumpRow {
  key: string;
  flowCoefficient: string;
  headCoefficient: string;
  efficiency: string;
}

export type NpshBasis = 'suction' | 'rated';

export interface MatchedDraft {
  engineRows: EngineRow[];
  limiterRpm: string;
  impellerMm: string;
  pumpRows: PumpRow[];
  nozzleMm: string;
  inletLoss: string;
  nozzleLoss: string;
  wakeFraction: string;
  waterKind: 'fresh' | 'sea';
  temperatureC: string;
  withCavitation: boolean;
  inletDepthM: string;
  npshBasis: NpshBasis;
  suctionSpecificSpeed: string;
  ratedNpshM: string;
  ratedRpm: string;
  ratedFlowM3s: string;
}

/**
 * Illustrative, invented curves (not a maker's data): a 300 kW-class engine and a 240 mm mixed-flow
 * pump shape, with a flush inlet K_i 0.2 and nozzle K_n 0.02 (common practice, no source).
 */
export function createExampleMatched(): MatchedDraft {
  const engine: [number, number][] = [
    [1500, 60],
    [3000, 170],
    [4500, 260],
    [5500, 300],
    [6200, 290],
  ];
  const pump: [number, number, number][] = [
    [0.08, 2.7, 0.62],
    [0.15, 2.4, 0.8],
    [0.22, 2.0, 0.87],
    [0.3, 1.5, 0.88],
    [0.38, 0.9, 0.82],
    [0.5, 0.1, 0.6],
  ];
  return {
    engineRows: engine.map(([rpm, kw], i) => ({ key: `e${i}`, rpm: String(rpm), powerKw: String(kw) })),
    limiterRpm: '',
    impellerMm: '240',
    pumpRows: pump.map(([f, h, e], i) => ({
      key: `p${i}`,
      flowCoefficient: String(f),
      headCoefficient: String(h),
      efficiency: String(e),
    })),
    nozzleMm: '100',
    inletLoss: '0.2',
    nozzleLoss: '0.02',
    wakeFraction: '',
    waterKind: 'fresh',
    temperatureC: '15',
    withCavitation: true,
    inletDepthM: '0.2',
    npshBasis: 'suction',
    suctionSpecificSpeed: '6',
    ratedNpshM: '',
    ratedRpm: '',
    ratedFlowM3s: '',
  };
}

/** Blank: undefined; a decimal comma is accepted; anything else not a number stays NaN (the schema names it). */
function parseNumber(text: string): number | undefined {
  const t = text.trim().replace(',', '.');
  return t === '' ? undefined : Number(t);
}
const required = (text: string) => parseNumber(text) ?? Number.NaN;

/** The body as the public route takes it, speeds aside. */
export function toMatchedBody(d: MatchedDraft) {
  const limiterRpm = parseNumber(d.limiterRpm);
  return {
    engine: {
      curve: d.engineRows.map((r) => ({ rpm: required(r.rpm), powerKw: required(r.powerKw) })),
      ...(limiterRpm !== undefined ? { limiterRpm } : {}),
    },
    pump: {
      impellerDiameterMm: required(d.impellerMm),
      curve: d.pumpRows.map((r) => ({
        flowCoefficient: required(r.flowCoefficient),
        headCoefficient: required(r.headCoefficient),
        efficiency: required(r.efficiency),
      })),
    },
    nozzleDiameterMm: required(d.nozzleMm),
    inletLossCoefficient: parseNumber(d.inletLoss),
    nozzleLossCoefficient: parseNumber(d.nozzleLoss),
    wakeFraction: parseNumber(d.wakeFraction),
    water: { kind: d.waterKind, temperatureC: required(d.temperatureC) },
    ...(d.withCavitation
      ? {
          cavitation: {
            inletDepthM: required(d.inletDepthM),
            ...(d.npshBasis === 'suction'
              ? { suctionSpecificSpeed: required(d.suctionSpecificSpeed) }
              : {
                  requiredNpshAtRated: {
                    npshM: required(d.ratedNpshM),
                    rpm: required(d.ratedRpm),
                    flowM3s: required(d.ratedFlowM3s),
                  },
                }),
          },
        }
      : {}),
  };
}

/** 'engine.curve[1].rpm' (engine) and ['engine','curve',1,'rpm'] (schema) both become 'engine.curve.1.rpm'. */
export function fieldKey(path: string | readonly PropertyKey[]): string {
  if (typeof path !== 'string') return path.map(String).join('.');
  return path.replace(/\[(\d+)\]/g, '.$1');
}

export type MatchedFieldErrors = Record<string, string>;

export interface NoOperatingPoint {
  curve: 'engine' | 'pump';
  fromMs: number;
  toMs: number;
  message: string;
}

export type MatchedOutcome =
  | {
      ok: true;
      densityKgM3: number;
      points: MatchedPerformancePoint[];
      /** Fixed-power figure per point (same index), at the first point's power and efficiency, for comparison. */
      fixed: (number | undefined)[];
      /** Speed ranges with no operating point (the points there are left out). */
      gaps: NoOperatingPoint[];
      withCavitation: boolean;
    }
  | { ok: false; fieldErrors: MatchedFieldErrors; gaps: NoOperatingPoint[]; message: string };

/**
 * The fixed-power model's thrust at `speedMs` with the shaft power and pump efficiency of `at` held
 * constant. (With each point's own power and efficiency the two models agree exactly, so the useful
 * comparison holds the first point's.)
 */
function fixedPowerThrust(
  input: MatchedPerformanceInput,
  at: MatchedPerformancePoint,
  speedMs: number,
): number | undefined {
  try {
    const [f] = computeJetPerformance({
      water: input.water,
      densityKgM3: input.densityKgM3,
      nozzleLossCoefficient: input.nozzleLossCoefficient,
      inletLossCoefficient: input.inletLossCoefficient,
      wakeFraction: input.wakeFraction,
      pumpEfficiency: at.pumpEfficiency,
      powerKw: at.shaftPowerKw,
      nozzleDiameterMm: input.nozzleDiameterMm,
      speedsMs: [speedMs],
    }).points;
    return f?.thrustN;
  } catch {
    return undefined;
  }
}

/**
 * Checks the draft with the route's schema, then finds the operating point at each speed of the
 * sweep one by one, so a speed without one leaves a gap (said in words) instead of losing the curve.
 */
export function computeMatchedOutcome(
  d: MatchedDraft,
  speedsMs: readonly number[] = MATCHED_SPEEDS_MS,
): MatchedOutcome {
  const parsed = matchedInputSchema.safeParse({ ...toMatchedBody(d), speedsMs });
  if (!parsed.success) {
    const fieldErrors: MatchedFieldErrors = {};
    for (const issue of parsed.error.issues) {
      const key = fieldKey(issue.path) || '(body)';
      fieldErrors[key] ??= issue.message;
    }
    return { ok: false, fieldErrors, gaps: [], message: 'Correct the marked fields to see the figures.' };
  }
  const input = parsed.data;
  const points: MatchedPerformancePoint[] = [];
  const gaps: NoOperatingPoint[] = [];
  let densityKgM3 = Number.NaN;
  let previousFailed = false;
  for (const speedMs of speedsMs) {
    try {
      const r = computeMatchedPerformance({ ...input, speedsMs: [speedMs] });
      densityKgM3 = r.densityKgM3;
      points.push(r.points[0]);
      previousFailed = false;
    } catch (err) {
      if (err instanceof EngineOperatingPointError) {
        const last = gaps[gaps.length - 1];
        if (previousFailed && last?.curve === err.curve) last.toMs = speedMs;
        else gaps.push({ curve: err.curve, fromMs: speedMs, toMs: speedMs, message: err.message });
        previousFailed = true;
        continue;
      }
      if (err instanceof EngineInputError) {
        return {
          ok: false,
          fieldErrors: { [fieldKey(err.field)]: err.message },
          gaps: [],
          message: 'Correct the marked fields to see the figures.',
        };
      }
      return {
        ok: false,
        fieldErrors: {},
        gaps: [],
        message: `The calculation could not be made with these inputs (${err instanceof Error ? err.message : 'unknown problem'}).`,
      };
    }
  }
  if (points.length === 0) {
    const errs: MatchedFieldErrors = {};
    for (const g of gaps) errs[`${g.curve}.curve`] ??= `No operating point: ${g.message}.`;
    return {
      ok: false,
      fieldErrors: errs,
      gaps,
      message:
        'No operating point at any speed: the engine and the pump do not meet with these curves and this nozzle.',
    };
  }
  return {
    ok: true,
    densityKgM3,
    points,
    fixed: points.map((p) => fixedPowerThrust(input, points[0], p.speedMs)),
    gaps,
    withCavitation: input.cavitation !== undefined,
  };
}

/** Contiguous speed ranges of the sweep where the inlet cavitates, for shading the chart. */
export function cavitatingRanges(points: readonly MatchedPerformancePoint[]): { fromMs: number; toMs: number }[] {
  const out: { fromMs: number; toMs: number }[] = [];
  points.forEach((p, i) => {
    if (!p.cavitating) return;
    const last = out[out.length - 1];
    const prev = points[i - 1];
    if (last && prev?.cavitating && last.toMs === prev.speedMs) last.toMs = p.speedMs;
    else out.push({ fromMs: p.speedMs, toMs: p.speedMs });
  });
  return out;
}

/** "at rest" or "12.5 m/s (45.0 km/h)". */
export function describeSpeed(ms: number): string {
  return ms === 0 ? 'at rest' : `${ms.toFixed(1)} m/s (${(ms * 3.6).toFixed(1)} km/h)`;
}
