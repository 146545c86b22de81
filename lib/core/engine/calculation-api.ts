// One function per public API body: each takes the parsed body (lib/core/inputs/calculation.ts)
// and returns exactly the response's `data` object, so a route handler is one line.
// Water: densityKgM3 wins over water; with neither, fresh water at 15 C on the ITTC basis.

import { evaluateConformity } from './conformity';
import type { DecisionRule, Verdict } from './conformity';
import { resolveOutcomeForMeasurement } from './conformity-burden';
import type { BurdenOfProof, ResolvedOutcome } from './conformity-burden';
import { computeThrustCurve } from './jet';
import type { JetModelAssumptions } from './jet';
import { computeCrossoverSpeedMs } from './jet-crossover';
import { computeMatchedCurve } from './jet-matched';
import { checkSuction, prepareSuction } from './cavitation';
import type { SuctionInput } from './cavitation';
import type { EngineCurvePoint, MatchedPoint, PumpCurvePoint } from './jet-matched';
import type { ParityBoatInput } from './parity';
import { DEFAULT_WATER, resolveDensity } from './water';
import type { DensityBasis, WaterKind } from './water';
import { EngineInputError } from './engine-input-error';

export interface WaterInput {
  kind: WaterKind;
  temperatureC: number;
  /** Default 'ittc' (10–25 C); 'eos80' covers 0–40 C. */
  basis?: DensityBasis;
}

export interface JetModelBody {
  water?: WaterInput;
  densityKgM3?: number;
  pumpEfficiency?: number;
  nozzleLossCoefficient?: number;
  inletLossCoefficient?: number;
  wakeFraction?: number;
}

export interface JetPerformanceInput extends JetModelBody {
  powerKw: number;
  nozzleDiameterMm: number;
  speedsMs: readonly number[];
}

export interface JetPerformancePoint {
  speedMs: number;
  jetVelocityMs: number;
  massFlowKgS: number;
  /** As computed; may be negative at high speed with losses (see isThrustPositive). */
  thrustN: number;
  isThrustPositive: boolean;
}

export interface JetPerformanceData {
  densityKgM3: number;
  points: JetPerformancePoint[];
}

export interface MatchedPerformanceInput extends Omit<JetModelBody, 'pumpEfficiency'> {
  engine: { curve: readonly EngineCurvePoint[]; limiterRpm?: number };
  pump: { impellerDiameterMm: number; curve: readonly PumpCurvePoint[] };
  nozzleDiameterMm: number;
  speedsMs: readonly number[];
  /** When given, each point says whether the pump inlet cavitates (waterTemperatureC defaults to the water's). */
  cavitation?: Omit<SuctionInput, 'waterTemperatureC'> & { waterTemperatureC?: number };
}

export type MatchedPerformancePoint = MatchedPoint & {
  /** Only when the body gave cavitation: NPSH available and required, m, and whether it cavitates. */
  availableNpshM?: number;
  requiredNpshM?: number;
  cavitating?: boolean;
};

export interface MatchedPerformanceData {
  densityKgM3: number;
  points: MatchedPerformancePoint[];
}

export interface CrossoverInput extends JetModelBody {
  powerKw: number;
  nozzleDiametersMm: readonly [number, number];
}

export interface CrossoverData {
  /** null when the curves do not cross below 100 m/s. */
  crossoverSpeedMs: number | null;
}

export interface ConformityBody {
  readingsMm: readonly number[];
  maxMm?: number;
  minMm?: number;
  expandedUncertaintyMm: number;
  rule: DecisionRule;
  /** Who must prove: when given, the answer carries `outcome` too (without it, the answer is as before). */
  burdenOfProof?: BurdenOfProof;
}

export interface ConformityData {
  decisiveValueMm: number;
  verdict: Verdict;
  explanation: string;
  acceptanceLimitsMm: { maxMm: number | null; minMm: number | null };
  /** Only when the body gave burdenOfProof. */
  outcome?: ResolvedOutcome;
}

export interface ParityBody extends JetModelBody {
  boats: readonly ParityBoatInput[];
  referenceSpeedsMs?: readonly number[];
}

function resolveModel(body: JetModelBody): JetModelAssumptions {
  if (body === null || typeof body !== 'object')
    throw new EngineInputError('body', 'A request body object is required');
  const { densityKgM3 } = resolveDensity(
    body.densityKgM3 !== undefined ? { densityKgM3: body.densityKgM3 } : (body.water ?? DEFAULT_WATER),
  );
  return {
    densityKgM3,
    pumpEfficiency: body.pumpEfficiency ?? 1,
    nozzleLossCoefficient: body.nozzleLossCoefficient ?? 0,
    inletLossCoefficient: body.inletLossCoefficient ?? 0,
    wakeFraction: body.wakeFraction ?? 0,
  };
}

/** POST /api/v1/jet-performance */
export function computeJetPerformance(input: JetPerformanceInput): JetPerformanceData {
  const model = resolveModel(input);
  const points = computeThrustCurve(
    { ...model, powerKw: input.powerKw, nozzleDiameterMm: input.nozzleDiameterMm },
    input.speedsMs,
  ).map((p) => ({
    speedMs: p.speedMs,
    jetVelocityMs: p.jetVelocityMs,
    massFlowKgS: p.massFlowKgS,
    thrustN: p.thrustN,
    isThrustPositive: p.isThrustPositive,
  }));
  return { densityKgM3: model.densityKgM3, points };
}

/** POST /api/v1/jet-performance/matched (the pump's efficiency comes from its curve). */
export function computeMatchedPerformance(input: MatchedPerformanceInput): MatchedPerformanceData {
  const model = resolveModel(input);
  const points = computeMatchedCurve(
    {
      engine: input.engine,
      pump: input.pump,
      nozzleDiameterMm: input.nozzleDiameterMm,
      densityKgM3: model.densityKgM3,
      nozzleLossCoefficient: model.nozzleLossCoefficient,
      inletLossCoefficient: model.inletLossCoefficient,
      wakeFraction: model.wakeFraction,
    },
    input.speedsMs,
  );
  if (input.cavitation === undefined) return { densityKgM3: model.densityKgM3, points };
  const suction = prepareSuction({
    ...input.cavitation,
    waterTemperatureC: input.cavitation.waterTemperatureC ?? (input.water ?? DEFAULT_WATER).temperatureC,
  });
  return {
    densityKgM3: model.densityKgM3,
    points: points.map((p) => {
      const c = checkSuction(
        suction,
        model.densityKgM3,
        model.inletLossCoefficient ?? 0,
        p.rpm,
        p.flowM3s,
        (1 - (model.wakeFraction ?? 0)) * p.speedMs,
      );
      return { ...p, availableNpshM: c.availableNpshM, requiredNpshM: c.requiredNpshM, cavitating: c.cavitating };
    }),
  };
}

/** POST /api/v1/jet-performance/crossover */
export function computeCrossover(input: CrossoverInput): CrossoverData {
  const model = resolveModel(input);
  const diameters = input.nozzleDiametersMm;
  if (!Array.isArray(diameters) || diameters.length !== 2) {
    throw new EngineInputError('nozzleDiametersMm', 'Give exactly two nozzle diameters');
  }
  const [a, b] = diameters.map((d, i) => {
    if (typeof d !== 'number')
      throw new EngineInputError(`nozzleDiametersMm[${i}]`, 'Nozzle diameter must be a number');
    return { ...model, powerKw: input.powerKw, nozzleDiameterMm: d };
  });
  return { crossoverSpeedMs: computeCrossoverSpeedMs(a, b) };
}

/** POST /api/v1/conformity */
export function decideConformity(input: ConformityBody): ConformityData {
  const { burdenOfProof, ...body } = input;
  const r = evaluateConformity(body);
  const data: ConformityData = {
    decisiveValueMm: r.decisiveValueMm,
    verdict: r.verdict,
    explanation: r.explanation,
    acceptanceLimitsMm: r.acceptanceLimitsMm,
  };
  // The key is absent (not undefined) without a burden, so the answer is byte for byte what it was.
  if (burdenOfProof !== undefined) data.outcome = resolveOutcomeForMeasurement(body, r.verdict, burdenOfProof);
  return data;
}
