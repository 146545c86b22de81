// The jet matched to its engine: the pump settles where the engine's power curve meets the power the
// pump absorbs, instead of one fixed shaft power at every nozzle and speed (jet.ts).
//
// Pump (dimensionless characteristic and the affinity laws; Karassik et al., Pump Handbook, 4th ed.,
// 2008, ch. 2; Brennen, Hydrodynamics of Pumps, 1994, ch. 1), with n = rpm/60 and D the impeller
// diameter:
//   Q = phi n D^3,   g H = psi(phi) n^2 D^2,   absorbed power P_a = rho g Q H / eta(phi)
//   psi and eta linear in phi between the maker's points.
// System (the momentum balance of jet.ts with A_n the nozzle area, V_in = (1 - w) V):
//   g H_sys = 1/2 (1 + K_n) (Q/A_n)^2 - 1/2 (1 - K_i) V_in^2,   T = rho Q (Q/A_n - V_in).
// Engine: shaft power P_e(rpm) linear between its points (power at the pump shaft).
//
// At one rpm the head balance psi(phi) n^2 D^2 = g H_sys reads, with c = 1/2 (1 + K_n) D^4 / A_n^2 and
// s = 1/2 (1 - K_i) V_in^2 / (n^2 D^2),
//   f(phi) = c phi^2 - s - psi(phi) = 0,
// a quadratic on each segment of the pump curve, solved in closed form. f is convex on each segment,
// and the operating point is the first crossing of f from below zero to zero or above (the stable
// intersection: at a larger flow the system asks for more head than the pump gives). At rest s = 0,
// so phi does not depend on rpm and P_a = rho n^3 D^5 phi psi / eta grows as rpm^3 (affinity laws).
//
// The operating rpm is the lowest rpm of the engine curve's range (capped at the limiter) at which
// P_a = P_e. Between two points of the engine curve P_e is linear and P_a convex in rpm (exactly so at
// rest), so a root is bracketed by the sign of P_a - P_e at the curve's points and refined with the
// Illinois variant of regula falsi (Dowell and Jarratt, BIT 11, 1971), which keeps the bracket.
// Where the pump never absorbs the engine's power below the top of the range, the rpm is that top and
// the pump takes what it absorbs there (limitedBy 'limiter'). Where the pump absorbs more than the
// engine gives at the lowest rpm, the engine is held below its curve; where the balance falls outside
// the pump curve's flow range, there is no operating point on the data given: both are
// EngineOperatingPointError (HTTP 422), naming which curve.

import {
  EngineInputError,
  EngineOperatingPointError,
  assertFiniteNumber,
  assertInHalfOpenRange,
  assertPositive,
} from './engine-input-error';
import { MAX_SPEED_MS } from './jet';

export const MATCHED_MAX_CURVE_POINTS = 64;

export interface EngineCurvePoint {
  rpm: number;
  powerKw: number;
}

export interface PumpCurvePoint {
  flowCoefficient: number;
  headCoefficient: number;
  efficiency: number;
}

export interface MatchedSetupInput {
  engine: { curve: readonly EngineCurvePoint[]; limiterRpm?: number };
  pump: { impellerDiameterMm: number; curve: readonly PumpCurvePoint[] };
  nozzleDiameterMm: number;
  densityKgM3: number;
  nozzleLossCoefficient?: number;
  inletLossCoefficient?: number;
  wakeFraction?: number;
}

export type MatchedLimit = 'engine' | 'limiter';

export interface MatchedPoint {
  speedMs: number;
  rpm: number;
  shaftPowerKw: number;
  flowM3s: number;
  flowCoefficient: number;
  pumpEfficiency: number;
  jetVelocityMs: number;
  thrustN: number;
  limitedBy: MatchedLimit;
}

/** Validated set-up with its constants prepared once (typed arrays, no allocation per point). */
export interface PreparedMatchedSetup {
  readonly densityKgM3: number;
  readonly nozzleDiameterMm: number;
  readonly impellerDiameterM: number;
  readonly nozzleAreaM2: number;
  readonly nozzleLossCoefficient: number;
  readonly inletLossCoefficient: number;
  readonly wakeFraction: number;
  /** Engine curve: rpm and power in W. */
  readonly engineRpm: Float64Array;
  readonly enginePowerW: Float64Array;
  readonly limiterRpm: number | null;
  /** Lowest and highest rpm searched: the curve's range, its top capped at the limiter. */
  readonly lowRpm: number;
  readonly topRpm: number;
  readonly phi: Float64Array;
  readonly psi: Float64Array;
  readonly eta: Float64Array;
  /** c = 1/2 (1 + K_n) D^4 / A_n^2. */
  readonly headFactor: number;
  /** 1/2 (1 - K_i): s = inletFactor V_in^2 / (n^2 D^2). */
  readonly inletFactor: number;
}

/** The prepared set-up as the hot path reads it (the class below). */
type Prepared = PreparedMatched;

class PreparedMatched implements PreparedMatchedSetup {
  // Not readonly inside this module: retuneMatchedSetup rewrites a working copy in place.
  nozzleDiameterMm: number;
  nozzleAreaM2 = 0;
  headFactor = 0;
  readonly inletFactor: number;
  readonly lowRpm: number;
  readonly topRpm: number;
  // Per-segment constants of the hot path (segment j between pump points j and j + 1; k engine).
  /** f at pump point j for s = 0: h_j = c phi_j^2 - psi_j (f = h - s). */
  readonly h: Float64Array;
  /** Lowest f + s inside segment j when its vertex lies inside, else +Infinity. */
  readonly dip: Float64Array;
  readonly psiSlope: Float64Array;
  readonly psiIntercept: Float64Array;
  readonly etaSlope: Float64Array;
  readonly etaIntercept: Float64Array;
  readonly engineSlopeWPerRpm: Float64Array;
  /** rho D^5 / 60^3: absorbed power = powerFactor rpm^3 phi psi / eta. */
  readonly powerFactor: number;
  /** 60^2 / D^2: s = inletFactor V_in^2 sFactor / rpm^2. */
  readonly sFactor: number;

  constructor(
    readonly densityKgM3: number,
    nozzleDiameterMm: number,
    readonly impellerDiameterM: number,
    readonly nozzleLossCoefficient: number,
    readonly inletLossCoefficient: number,
    readonly wakeFraction: number,
    readonly engineRpm: Float64Array,
    readonly enginePowerW: Float64Array,
    readonly limiterRpm: number | null,
    readonly phi: Float64Array,
    readonly psi: Float64Array,
    readonly eta: Float64Array,
  ) {
    this.nozzleDiameterMm = nozzleDiameterMm;
    const d2 = impellerDiameterM * impellerDiameterM;
    this.inletFactor = 0.5 * (1 - inletLossCoefficient);
    this.lowRpm = engineRpm[0];
    const curveTop = engineRpm[engineRpm.length - 1];
    this.topRpm = limiterRpm === null ? curveTop : Math.min(curveTop, limiterRpm);
    const m = phi.length;
    this.h = new Float64Array(m);
    this.dip = new Float64Array(m - 1);
    this.psiSlope = new Float64Array(m - 1);
    this.psiIntercept = new Float64Array(m - 1);
    this.etaSlope = new Float64Array(m - 1);
    this.etaIntercept = new Float64Array(m - 1);
    for (let j = 0; j < m - 1; j++) {
      const b = (psi[j + 1] - psi[j]) / (phi[j + 1] - phi[j]);
      this.psiSlope[j] = b;
      this.psiIntercept[j] = psi[j] - b * phi[j];
      const e = (eta[j + 1] - eta[j]) / (phi[j + 1] - phi[j]);
      this.etaSlope[j] = e;
      this.etaIntercept[j] = eta[j] - e * phi[j];
    }
    this.setNozzle(nozzleDiameterMm);
    this.engineSlopeWPerRpm = new Float64Array(engineRpm.length - 1);
    this.setEnginePower(enginePowerW, 1);
    const d5 = impellerDiameterM ** 5;
    this.powerFactor = (densityKgM3 * d5) / 216_000;
    this.sFactor = 3600 / d2;
  }

  /** The nozzle-dependent constants for diameter d (mm): area, head factor, h and dip. No allocation. */
  setNozzle(nozzleDiameterMm: number): void {
    this.nozzleDiameterMm = nozzleDiameterMm;
    const dn = nozzleDiameterMm / 1000;
    this.nozzleAreaM2 = (Math.PI * dn * dn) / 4;
    const d2 = this.impellerDiameterM * this.impellerDiameterM;
    this.headFactor = (0.5 * (1 + this.nozzleLossCoefficient) * d2 * d2) / (this.nozzleAreaM2 * this.nozzleAreaM2);
    const { phi, psi } = this;
    const c = this.headFactor;
    for (let j = 0; j < phi.length; j++) this.h[j] = c * phi[j] * phi[j] - psi[j];
    for (let j = 0; j < phi.length - 1; j++) {
      const b = this.psiSlope[j];
      // f + s = c phi^2 - b phi - intercept is convex; its lowest point is at phi = b / (2c).
      const v = b / (2 * c);
      this.dip[j] = v > phi[j] && v < phi[j + 1] ? c * v * v - b * v - this.psiIntercept[j] : Infinity;
    }
  }

  /** The engine curve's power set to `powerW` × factor point by point, and its slopes. No allocation. */
  setEnginePower(powerW: Float64Array, factor: number): void {
    const { engineRpm, enginePowerW } = this;
    for (let k = 0; k < engineRpm.length; k++) enginePowerW[k] = powerW[k] * factor;
    for (let k = 0; k < engineRpm.length - 1; k++)
      this.engineSlopeWPerRpm[k] = (enginePowerW[k + 1] - enginePowerW[k]) / (engineRpm[k + 1] - engineRpm[k]);
  }
}

/**
 * A working copy of a prepared set-up, for `retuneMatchedSetup` to rewrite in a loop (it allocates
 * once, here; the source is never changed).
 */
export function copyMatchedSetup(setupInput: MatchedSetupInput | PreparedMatchedSetup): PreparedMatchedSetup {
  const s = prepareMatchedSetup(setupInput) as Prepared;
  return new PreparedMatched(
    s.densityKgM3,
    s.nozzleDiameterMm,
    s.impellerDiameterM,
    s.nozzleLossCoefficient,
    s.inletLossCoefficient,
    s.wakeFraction,
    Float64Array.from(s.engineRpm),
    Float64Array.from(s.enginePowerW),
    s.limiterRpm,
    Float64Array.from(s.phi),
    Float64Array.from(s.psi),
    Float64Array.from(s.eta),
  );
}

/**
 * Rewrites `work` (from `copyMatchedSetup(source)`) as `source` with its whole engine curve scaled by
 * `powerFactor` and its nozzle at `nozzleDiameterMm`; allocation-free, for Monte Carlo trials and
 * nozzle searches. Inputs are the caller's to check (positive, finite).
 */
export function retuneMatchedSetup(
  work: PreparedMatchedSetup,
  source: PreparedMatchedSetup,
  powerFactor: number,
  nozzleDiameterMm: number,
): PreparedMatchedSetup {
  if (!(work instanceof PreparedMatched) || !(source instanceof PreparedMatched) || work === source)
    throw new EngineInputError('setup', 'Retune a working copy made by copyMatchedSetup, not the source');
  if (work.engineRpm.length !== source.engineRpm.length || work.phi.length !== source.phi.length)
    throw new EngineInputError('setup', 'The working copy is not of this set-up');
  work.setEnginePower(source.enginePowerW, powerFactor);
  if (work.nozzleDiameterMm !== nozzleDiameterMm) work.setNozzle(nozzleDiameterMm);
  return work;
}

function curveArray<T>(field: string, value: unknown): readonly T[] {
  if (!Array.isArray(value)) throw new EngineInputError(field, `${field} must be an array of points`);
  if (value.length < 2) throw new EngineInputError(field, `${field} needs at least 2 points`);
  if (value.length > MATCHED_MAX_CURVE_POINTS)
    throw new EngineInputError(field, `${field} takes at most ${MATCHED_MAX_CURVE_POINTS} points`);
  for (let i = 0; i < value.length; i++) {
    if (value[i] === null || typeof value[i] !== 'object')
      throw new EngineInputError(`${field}[${i}]`, `${field}[${i}] must be an object`);
  }
  return value as readonly T[];
}

export function prepareMatchedSetup(input: MatchedSetupInput | PreparedMatchedSetup): PreparedMatchedSetup {
  if (input instanceof PreparedMatched) return input;
  if (input === null || typeof input !== 'object') throw new EngineInputError('setup', 'A set-up object is required');
  const i = input as MatchedSetupInput;
  if (i.engine === null || typeof i.engine !== 'object') throw new EngineInputError('engine', 'engine is required');
  if (i.pump === null || typeof i.pump !== 'object') throw new EngineInputError('pump', 'pump is required');

  const ec = curveArray<EngineCurvePoint>('engine.curve', i.engine.curve);
  const engineRpm = new Float64Array(ec.length);
  const enginePowerW = new Float64Array(ec.length);
  for (let k = 0; k < ec.length; k++) {
    engineRpm[k] = assertPositive(`engine.curve[${k}].rpm`, ec[k].rpm);
    const kw = assertFiniteNumber(`engine.curve[${k}].powerKw`, ec[k].powerKw);
    if (kw < 0) throw new EngineInputError(`engine.curve[${k}].powerKw`, 'Power must not be negative');
    enginePowerW[k] = kw * 1000;
    if (k > 0 && !(engineRpm[k] > engineRpm[k - 1]))
      throw new EngineInputError(`engine.curve[${k}].rpm`, 'The engine curve must have rpm increasing');
  }
  const limiterRpm =
    i.engine.limiterRpm === undefined ? null : assertPositive('engine.limiterRpm', i.engine.limiterRpm);

  const pc = curveArray<PumpCurvePoint>('pump.curve', i.pump.curve);
  const phi = new Float64Array(pc.length);
  const psi = new Float64Array(pc.length);
  const eta = new Float64Array(pc.length);
  for (let k = 0; k < pc.length; k++) {
    phi[k] = assertPositive(`pump.curve[${k}].flowCoefficient`, pc[k].flowCoefficient);
    psi[k] = assertFiniteNumber(`pump.curve[${k}].headCoefficient`, pc[k].headCoefficient);
    const e = assertFiniteNumber(`pump.curve[${k}].efficiency`, pc[k].efficiency);
    if (!(e > 0 && e <= 1))
      throw new EngineInputError(`pump.curve[${k}].efficiency`, `Efficiency must be above 0 and at most 1 (got ${e})`);
    eta[k] = e;
    if (k > 0 && !(phi[k] > phi[k - 1]))
      throw new EngineInputError(
        `pump.curve[${k}].flowCoefficient`,
        'The pump curve must have flowCoefficient increasing',
      );
  }
  const impellerMm = assertPositive('pump.impellerDiameterMm', i.pump.impellerDiameterMm);
  const nozzleMm = assertPositive('nozzleDiameterMm', i.nozzleDiameterMm);
  const density = assertPositive('densityKgM3', i.densityKgM3);
  const kn = assertInHalfOpenRange('nozzleLossCoefficient', i.nozzleLossCoefficient ?? 0, 0, 1);
  const ki = assertInHalfOpenRange('inletLossCoefficient', i.inletLossCoefficient ?? 0, 0, 1);
  const w = assertInHalfOpenRange('wakeFraction', i.wakeFraction ?? 0, 0, 1);
  return new PreparedMatched(
    density,
    nozzleMm,
    impellerMm / 1000,
    kn,
    ki,
    w,
    engineRpm,
    enginePowerW,
    limiterRpm,
    phi,
    psi,
    eta,
  );
}

// Results of the head balance at one rpm, kept in module scratch so the hot path allocates nothing.
// OFF_RIGHT: the system asks for less head than the pump gives even at the curve's largest flow
// coefficient (the point lies beyond it); OFF_LEFT: more head than the pump gives at its smallest.
const OFF_RIGHT = -1;
const OFF_LEFT = -2;
let scratchSegment = 0;

/** Operating flow coefficient at head-balance parameter s, or OFF_RIGHT / OFF_LEFT. */
function solveFlowCoefficient(setup: Prepared, s: number): number {
  const { phi, h, dip, psiSlope, psiIntercept, headFactor: c } = setup;
  const last = phi.length - 1;
  for (let j = 0; j < last; j++) {
    // f = h - s at the ends; a crossing from below, or a dip below zero between two ends above it.
    if (h[j + 1] >= s && (h[j] <= s || dip[j] < s)) {
      // f = c phi^2 - b phi - a on this segment, a = intercept + s; the upward crossing is the larger root.
      const b = psiSlope[j];
      const disc = b * b + 4 * c * (psiIntercept[j] + s);
      let root = (b + Math.sqrt(disc > 0 ? disc : 0)) / (2 * c);
      if (root < phi[j]) root = phi[j];
      else if (root > phi[j + 1]) root = phi[j + 1];
      scratchSegment = j;
      return root;
    }
  }
  return h[last] < s ? OFF_RIGHT : OFF_LEFT;
}

function efficiencyAt(setup: Prepared, phiOp: number): number {
  const j = scratchSegment;
  return setup.etaIntercept[j] + setup.etaSlope[j] * phiOp;
}

// The state at the last rpm evaluated (module scratch, like scratchSegment).
let scratchPhi = 0;
let scratchAbsorbedW = 0;
let scratchRpm = NaN;

/**
 * Power the pump absorbs at this rpm (W), or NaN with scratchPhi = OFF_*; sInflow is
 * inletFactor V_in^2 sFactor, so that s = sInflow / rpm^2.
 */
function absorbedPowerW(setup: Prepared, rpm: number, sInflow: number): number {
  const phiOp = solveFlowCoefficient(setup, sInflow / (rpm * rpm));
  scratchPhi = phiOp;
  scratchRpm = rpm;
  if (phiOp < 0) return NaN;
  const j = scratchSegment;
  const psiOp = setup.psiIntercept[j] + setup.psiSlope[j] * phiOp;
  const etaOp = setup.etaIntercept[j] + setup.etaSlope[j] * phiOp;
  scratchAbsorbedW = (setup.powerFactor * rpm * rpm * rpm * phiOp * psiOp) / etaOp;
  return scratchAbsorbedW;
}

/** Engine power (W) at rpm on segment k (between points k and k + 1). */
function enginePowerOnSegment(setup: Prepared, k: number, rpm: number): number {
  return setup.enginePowerW[k] + setup.engineSlopeWPerRpm[k] * (rpm - setup.engineRpm[k]);
}

function describe(speedMs: number): string {
  return speedMs === 0 ? 'at rest' : `at ${speedMs} m/s`;
}

function offCurveError(setup: PreparedMatchedSetup, side: number, speedMs: number): EngineOperatingPointError {
  const { phi } = setup;
  return side === OFF_RIGHT
    ? new EngineOperatingPointError(
        'pump',
        speedMs,
        `${describe(speedMs)} the operating point lies beyond the pump curve's largest flow coefficient (${phi[phi.length - 1]}): extend the curve or check the nozzle size`,
      )
    : new EngineOperatingPointError(
        'pump',
        speedMs,
        `${describe(speedMs)} the operating point lies below the pump curve's smallest flow coefficient (${phi[0]}): extend the curve or check the nozzle size`,
      );
}

/** rpm at which the head balance reaches the curve's end on `side` (where f at that end is zero), or NaN. */
function curveEdgeRpm(setup: PreparedMatchedSetup, side: number, inflowMs: number): number {
  const { phi, psi, headFactor: c, inletFactor, impellerDiameterM: d } = setup;
  const k = side === OFF_RIGHT ? phi.length - 1 : 0;
  const sEdge = c * phi[k] * phi[k] - psi[k];
  if (!(sEdge > 0) || inflowMs === 0) return NaN;
  return 60 * Math.sqrt((inletFactor * inflowMs * inflowMs) / (d * d * sEdge));
}

const MAX_ITERATIONS = 200;

/**
 * The root of P_a - P_e in [a, b] (engine segment k), given g = P_a - P_e with g(a) < 0 <= g(b).
 * Illinois regula falsi on G(rpm) = rpm (1 - cbrt(P_e / P_a)), which has the sign of g and the same
 * root, and is exactly linear at rest against a flat curve (P_a = K rpm^3 gives G = rpm - rpm*), so
 * the secant steps land almost at once. Stops when |G| <= 1e-13 rpm (the power balance then holds to
 * about 3e-13 relative) or the bracket is tight.
 */
function transformed(r: number, pa: number, pe: number): number {
  return pa > 0 ? r * (1 - Math.cbrt(pe / pa)) : -r;
}

function refineRpm(
  setup: Prepared,
  k: number,
  sInflow: number,
  speedMs: number,
  a: number,
  ga: number,
  b: number,
  gb: number,
): number {
  const peA = enginePowerOnSegment(setup, k, a);
  const peB = enginePowerOnSegment(setup, k, b);
  let fa = transformed(a, ga + peA, peA);
  let fb = transformed(b, gb + peB, peB);
  if (fb === 0) {
    absorbedPowerW(setup, b, sInflow);
    return b;
  }
  let side = 0;
  let r = b;
  for (let it = 0; it < MAX_ITERATIONS; it++) {
    r = b - (fb * (b - a)) / (fb - fa);
    if (!(r > a && r < b)) r = 0.5 * (a + b);
    let pe = enginePowerOnSegment(setup, k, r);
    let pa = absorbedPowerW(setup, r, sInflow);
    if (Number.isNaN(pa)) {
      // Not on the pump curve inside the bracket (a curve whose head rises with flow): bisect instead.
      r = 0.5 * (a + b);
      pe = enginePowerOnSegment(setup, k, r);
      pa = absorbedPowerW(setup, r, sInflow);
      if (Number.isNaN(pa)) throw offCurveError(setup, scratchPhi, speedMs);
    }
    const fr = transformed(r, pa, pe);
    if (Math.abs(fr) <= 1e-13 * r || b - a <= 1e-14 * b) return r;
    if (fr < 0) {
      a = r;
      fa = fr;
      if (side === -1) fb *= 0.5;
      side = -1;
    } else {
      b = r;
      fb = fr;
      if (side === 1) fa *= 0.5;
      side = 1;
    }
  }
  return r;
}

/** Writes the operating point at boat speed V into `out` (allocation-free hot path). */
export function evaluateMatchedPoint(
  setupInput: PreparedMatchedSetup,
  speedMs: number,
  out: MatchedPoint,
): MatchedPoint {
  const setup = prepareMatchedSetup(setupInput) as Prepared;
  if (!(speedMs >= 0 && speedMs <= MAX_SPEED_MS))
    throw new EngineInputError('speedMs', `speedMs must be a speed from 0 to ${MAX_SPEED_MS} m/s (got ${speedMs})`);
  const inflow = (1 - setup.wakeFraction) * speedMs;
  const sInflow = setup.inletFactor * inflow * inflow * setup.sFactor;
  const { engineRpm: er, lowRpm, topRpm } = setup;
  if (setup.limiterRpm !== null && setup.limiterRpm < lowRpm) {
    throw new EngineOperatingPointError(
      'engine',
      speedMs,
      `the limiter (${setup.limiterRpm} rpm) holds the engine below its curve, which starts at ${lowRpm} rpm`,
    );
  }

  let rpm = NaN;
  let limitedBy: MatchedLimit = 'engine';
  // Previous sample: rpm, P_a - P_e (NaN when off the pump curve) and which side it was off.
  let prevRpm = lowRpm;
  let prevG = absorbedPowerW(setup, lowRpm, sInflow) - setup.enginePowerW[0];
  let prevSide = scratchPhi < 0 ? scratchPhi : 0;
  if (!Number.isNaN(prevG) && prevG >= 0) {
    if (prevG > 1e-14 * setup.enginePowerW[0]) {
      throw new EngineOperatingPointError(
        'engine',
        speedMs,
        `${describe(speedMs)} the pump absorbs ${(scratchAbsorbedW / 1000).toPrecision(4)} kW at ${lowRpm} rpm, more than the engine's ${(setup.enginePowerW[0] / 1000).toPrecision(4)} kW: the engine is held below its curve`,
      );
    }
    rpm = lowRpm;
  }
  for (let k = 0; Number.isNaN(rpm) && k < er.length - 1 && er[k] < topRpm; k++) {
    const r = er[k + 1] < topRpm ? er[k + 1] : topRpm;
    const g = absorbedPowerW(setup, r, sInflow) - enginePowerOnSegment(setup, k, r);
    const side = scratchPhi < 0 ? scratchPhi : 0;
    if (Number.isNaN(g)) {
      // Was on the curve and short of the engine's power, now off it: the balance is not on the curve.
      if (!Number.isNaN(prevG)) throw offCurveError(setup, side, speedMs);
    } else if (g >= 0) {
      let a = prevRpm;
      let ga = prevG;
      if (Number.isNaN(prevG)) {
        // Entered the pump curve between the samples: start the bracket where it enters.
        const edge = curveEdgeRpm(setup, prevSide, inflow);
        a = edge > prevRpm && edge < r ? edge : bisectCurveEntry(setup, sInflow, prevRpm, r);
        ga = absorbedPowerW(setup, a, sInflow) - enginePowerOnSegment(setup, k, a);
        if (Number.isNaN(ga)) a = bisectCurveEntry(setup, sInflow, prevRpm, r);
        ga = absorbedPowerW(setup, a, sInflow) - enginePowerOnSegment(setup, k, a);
        if (Number.isNaN(ga) || ga > 0) throw offCurveError(setup, prevSide, speedMs);
      }
      rpm = ga === 0 ? a : refineRpm(setup, k, sInflow, speedMs, a, ga, r, g);
    }
    prevRpm = r;
    prevG = g;
    prevSide = side;
  }
  if (Number.isNaN(rpm)) {
    if (Number.isNaN(prevG)) throw offCurveError(setup, prevSide, speedMs);
    rpm = topRpm;
    limitedBy = 'limiter';
  }
  // The state at the rpm returned (the last evaluation may have been another rpm).
  if (scratchRpm !== rpm) absorbedPowerW(setup, rpm, sInflow);
  const n = rpm / 60;
  const d = setup.impellerDiameterM;
  const q = scratchPhi * n * d * d * d;
  const vj = q / setup.nozzleAreaM2;
  out.speedMs = speedMs;
  out.rpm = rpm;
  out.shaftPowerKw = scratchAbsorbedW / 1000;
  out.flowM3s = q;
  out.flowCoefficient = scratchPhi;
  out.pumpEfficiency = efficiencyAt(setup, scratchPhi);
  out.jetVelocityMs = vj;
  out.thrustN = setup.densityKgM3 * q * (vj - inflow);
  out.limitedBy = limitedBy;
  return out;
}

/** Lowest rpm in (lo, hi] at which the point is on the pump curve, by bisection (rare path). */
function bisectCurveEntry(setup: Prepared, sInflow: number, lo: number, hi: number): number {
  for (let it = 0; it < 200 && hi - lo > 1e-13 * hi; it++) {
    const mid = 0.5 * (lo + hi);
    if (Number.isNaN(absorbedPowerW(setup, mid, sInflow))) lo = mid;
    else hi = mid;
  }
  return hi;
}

/** The operating point at each speed. */
export function computeMatchedCurve(
  setup: MatchedSetupInput | PreparedMatchedSetup,
  speedsMs: readonly number[],
): MatchedPoint[] {
  const prepared = prepareMatchedSetup(setup);
  return speedsMs.map((v, i) => {
    assertFiniteNumber(`speedsMs[${i}]`, v);
    return evaluateMatchedPoint(prepared, v, {
      speedMs: 0,
      rpm: 0,
      shaftPowerKw: 0,
      flowM3s: 0,
      flowCoefficient: 0,
      pumpEfficiency: 0,
      jetVelocityMs: 0,
      thrustN: 0,
      limitedBy: 'engine',
    });
  });
}
