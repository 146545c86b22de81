// Momentum theory of a water jet at fixed shaft power (Allison, "Marine Waterjet Propulsion",
// SNAME Transactions 101, 1993; Faltinsen, Hydrodynamics of High-Speed Marine Vehicles, 2005,
// section 2.11; loss form as in the MIT 2.611 Ship Power and Propulsion notes, 2006):
//   m_dot = rho A v_j,  T = m_dot (v_j - V_in),  V_in = (1 - w) V
//   eta_p P = 1/2 m_dot [ (1 + K_n) v_j^2 - (1 - K_i) V_in^2 ]
// so v_j is the positive root of  (1 + K_n) v^3 - (1 - K_i) V_in^2 v - 2 eta_p P / (rho A) = 0.
// Divided by (1 + K_n) this is the depressed cubic v^3 - p v - q = 0 with p >= 0, q > 0, which has
// exactly one positive root (the other two, if real, are negative since their sum is -v and their
// product q/v > 0), and that root lies above sqrt(p) = V_in sqrt((1 - K_i)/(1 + K_n)).
//
// Net thrust <= 0: with losses, at high speed the jet may no longer outrun the inflow. We report
// the thrust as computed (it may be negative: the pump is then a net drag in this model, which
// real pumps would not reach without cavitating) and set isThrustPositive = false on the point.
// Nothing is clamped, so curves stay continuous and honest.

import { EngineInputError, assertFiniteNumber, assertInHalfOpenRange, assertPositive } from './engine-input-error';

/** Highest boat speed accepted (m/s): far above any boat, keeps the cubic in floating range. */
export const MAX_SPEED_MS = 1000;
/** Bounds on q = v_j0^3 (1e-10 <= v_j0 <= 1e9 m/s): sanity limits that keep q^2 and (p/3)^1.5
 *  from overflowing or underflowing in the cubic, not physics. */
const MIN_CUBIC_Q = 1e-30;
const MAX_CUBIC_Q = 1e27;

export interface JetModelAssumptions {
  densityKgM3: number;
  /** eta_p in (0, 1]; default 1. */
  pumpEfficiency?: number;
  /** K_n in [0, 1); default 0. */
  nozzleLossCoefficient?: number;
  /** K_i in [0, 1); default 0. */
  inletLossCoefficient?: number;
  /** w in [0, 1); default 0. */
  wakeFraction?: number;
}

export interface JetSetupInput extends JetModelAssumptions {
  powerKw: number;
  nozzleDiameterMm: number;
}

/** Validated set-up with the per-set-up constants of the cubic precomputed (see header). */
export interface PreparedJetSetup {
  readonly powerKw: number;
  readonly nozzleDiameterMm: number;
  readonly densityKgM3: number;
  readonly pumpEfficiency: number;
  readonly nozzleLossCoefficient: number;
  readonly inletLossCoefficient: number;
  readonly wakeFraction: number;
  readonly nozzleAreaM2: number;
  /** rho A, kg/m: mass flow per unit jet velocity. */
  readonly rhoAreaKgM: number;
  /** 1 - w: inflow speed per unit boat speed. */
  readonly inflowFactor: number;
  /** p = pSpeedFactor V^2 with pSpeedFactor = (1 - K_i)(1 - w)^2 / (1 + K_n). */
  readonly pSpeedFactor: number;
  /** q = 2 eta_p P / ((1 + K_n) rho A), m^3/s^3; its cube root is the static jet velocity. */
  readonly q: number;
}

export interface JetPoint {
  speedMs: number;
  inflowSpeedMs: number;
  jetVelocityMs: number;
  massFlowKgS: number;
  /** Net thrust as computed; negative when the jet no longer outruns the inflow. */
  thrustN: number;
  isThrustPositive: boolean;
  /** Ideal (Froude) jet efficiency 2 / (1 + v_j/V); 0 at rest; null when thrust is not positive. */
  idealJetEfficiency: number | null;
}

export interface StaticPerformance {
  jetVelocityMs: number;
  massFlowKgS: number;
  thrustN: number;
}

// Prepared set-ups are instances of this class, so passing one back in skips re-validation
// (instanceof is cheap; a spread copy is a plain object and is validated again).
class PreparedSetup implements PreparedJetSetup {
  readonly nozzleAreaM2: number;
  readonly rhoAreaKgM: number;
  readonly inflowFactor: number;
  readonly pSpeedFactor: number;
  readonly q: number;

  constructor(
    readonly powerKw: number,
    readonly nozzleDiameterMm: number,
    readonly densityKgM3: number,
    readonly pumpEfficiency: number,
    readonly nozzleLossCoefficient: number,
    readonly inletLossCoefficient: number,
    readonly wakeFraction: number,
  ) {
    const d = nozzleDiameterMm / 1000;
    this.nozzleAreaM2 = (Math.PI * d * d) / 4;
    this.rhoAreaKgM = densityKgM3 * this.nozzleAreaM2;
    this.inflowFactor = 1 - wakeFraction;
    this.pSpeedFactor =
      ((1 - inletLossCoefficient) * this.inflowFactor * this.inflowFactor) / (1 + nozzleLossCoefficient);
    this.q = (2 * pumpEfficiency * powerKw * 1000) / ((1 + nozzleLossCoefficient) * this.rhoAreaKgM);
    // Keeps q^2 and T0 far from overflow so no result can become Infinity or NaN.
    if (
      !(this.q >= MIN_CUBIC_Q && this.q <= MAX_CUBIC_Q) ||
      !Number.isFinite(this.rhoAreaKgM * Math.cbrt(this.q * this.q))
    ) {
      throw new EngineInputError('powerKw', 'Power and nozzle size give a jet velocity the model cannot represent');
    }
  }
}

export function prepareJetSetup(input: JetSetupInput | PreparedJetSetup): PreparedJetSetup {
  if (input instanceof PreparedSetup) return input;
  if (input === null || typeof input !== 'object') {
    throw new EngineInputError('setup', 'A jet set-up object is required');
  }
  const powerKw = assertPositive('powerKw', input.powerKw);
  const nozzleDiameterMm = assertPositive('nozzleDiameterMm', input.nozzleDiameterMm);
  const densityKgM3 = assertPositive('densityKgM3', input.densityKgM3);
  const pumpEfficiency = assertFiniteNumber('pumpEfficiency', input.pumpEfficiency ?? 1);
  if (pumpEfficiency <= 0 || pumpEfficiency > 1) {
    throw new EngineInputError(
      'pumpEfficiency',
      `pumpEfficiency must be above 0 and at most 1 (got ${pumpEfficiency})`,
    );
  }
  const kn = assertInHalfOpenRange('nozzleLossCoefficient', input.nozzleLossCoefficient ?? 0, 0, 1);
  const ki = assertInHalfOpenRange('inletLossCoefficient', input.inletLossCoefficient ?? 0, 0, 1);
  const w = assertInHalfOpenRange('wakeFraction', input.wakeFraction ?? 0, 0, 1);
  return new PreparedSetup(powerKw, nozzleDiameterMm, densityKgM3, pumpEfficiency, kn, ki, w);
}

/** The same water and loss model with another power and nozzle (for parity and sensitivities). */
export function withPowerAndDiameter(
  setup: PreparedJetSetup,
  powerKw: number,
  nozzleDiameterMm: number,
): PreparedJetSetup {
  const s = prepareJetSetup(setup);
  return new PreparedSetup(
    assertPositive('powerKw', powerKw),
    assertPositive('nozzleDiameterMm', nozzleDiameterMm),
    s.densityKgM3,
    s.pumpEfficiency,
    s.nozzleLossCoefficient,
    s.inletLossCoefficient,
    s.wakeFraction,
  );
}

/**
 * Positive root of v^3 - p v - q = 0 (p >= 0, q > 0), closed form plus one Newton step.
 * One real root (disc >= 0): Cardano, written as u + p/(3u) so nothing cancels.
 * Three real roots: trigonometric form, largest root 2 sqrt(p/3) cos(acos(q / (2 (p/3)^1.5)) / 3).
 * The Newton polish repairs the precision acos loses near the branch switch; f'(v) >= 2p > 0
 * at the root (it lies above sqrt(p)), so the step is well conditioned.
 */
export function solveJetCubic(p: number, q: number): number {
  const p3 = p / 3;
  const disc = 0.25 * q * q - p3 * p3 * p3;
  let v: number;
  if (disc >= 0) {
    const u = Math.cbrt(0.5 * q + Math.sqrt(disc));
    v = u + p3 / u;
  } else {
    const r = Math.sqrt(p3);
    v = 2 * r * Math.cos(Math.acos((0.5 * q) / (r * r * r)) / 3);
  }
  const f = (v * v - p) * v - q;
  return v - f / (3 * v * v - p);
}

function assertSpeed(field: string, speedMs: number): number {
  if (!(speedMs >= 0 && speedMs <= MAX_SPEED_MS)) {
    throw new EngineInputError(field, `${field} must be a speed from 0 to ${MAX_SPEED_MS} m/s (got ${speedMs})`);
  }
  return speedMs;
}

/** Jet velocity at boat speed V (m/s) for a prepared set-up; allocation-free. */
export function evaluateJetVelocityMs(setup: PreparedJetSetup, speedMs: number): number {
  assertSpeed('speedMs', speedMs);
  return solveJetCubic(setup.pSpeedFactor * speedMs * speedMs, setup.q);
}

/** Net thrust (N) at boat speed V (m/s) for a prepared set-up; allocation-free. */
export function evaluateThrustN(setup: PreparedJetSetup, speedMs: number): number {
  assertSpeed('speedMs', speedMs);
  const v = solveJetCubic(setup.pSpeedFactor * speedMs * speedMs, setup.q);
  return setup.rhoAreaKgM * v * (v - setup.inflowFactor * speedMs);
}

/**
 * Hot path: thrust (and optionally jet velocity) at every speed into caller-owned arrays.
 * No allocation per point; per-set-up constants come from prepareJetSetup.
 */
export function fillThrustCurve(
  setup: PreparedJetSetup,
  speedsMs: Float64Array,
  outThrustN: Float64Array,
  outJetVelocityMs?: Float64Array,
): void {
  const n = speedsMs.length;
  if (outThrustN.length < n) throw new EngineInputError('outThrustN', 'Output array is shorter than speedsMs');
  if (outJetVelocityMs && outJetVelocityMs.length < n) {
    throw new EngineInputError('outJetVelocityMs', 'Output array is shorter than speedsMs');
  }
  const k = setup.pSpeedFactor;
  const q = setup.q;
  const rhoA = setup.rhoAreaKgM;
  const inflow = setup.inflowFactor;
  for (let i = 0; i < n; i++) {
    const speed = speedsMs[i];
    if (!(speed >= 0 && speed <= MAX_SPEED_MS)) assertSpeed(`speedsMs[${i}]`, speed);
    const v = solveJetCubic(k * speed * speed, q);
    outThrustN[i] = rhoA * v * (v - inflow * speed);
    if (outJetVelocityMs) outJetVelocityMs[i] = v;
  }
}

/** Ideal (Froude) jet efficiency 2 / (1 + v_j/V), written 2V/(V + v_j) so V = 0 gives 0. */
export function computeIdealJetEfficiency(jetVelocityMs: number, speedMs: number): number {
  return (2 * speedMs) / (speedMs + jetVelocityMs);
}

export function computeJetPoint(setup: JetSetupInput | PreparedJetSetup, speedMs: number): JetPoint {
  const s = prepareJetSetup(setup);
  const v = evaluateJetVelocityMs(s, speedMs);
  const inflowSpeedMs = s.inflowFactor * speedMs;
  const massFlowKgS = s.rhoAreaKgM * v;
  const thrustN = massFlowKgS * (v - inflowSpeedMs);
  const isThrustPositive = thrustN > 0;
  return {
    speedMs,
    inflowSpeedMs,
    jetVelocityMs: v,
    massFlowKgS,
    thrustN,
    isThrustPositive,
    idealJetEfficiency: isThrustPositive ? computeIdealJetEfficiency(v, speedMs) : null,
  };
}

export function computeThrustCurve(setup: JetSetupInput | PreparedJetSetup, speedsMs: readonly number[]): JetPoint[] {
  if (!Array.isArray(speedsMs)) throw new EngineInputError('speedsMs', 'speedsMs must be an array of speeds');
  const s = prepareJetSetup(setup);
  return speedsMs.map((speed, i) => {
    assertSpeed(`speedsMs[${i}]`, speed);
    return computeJetPoint(s, speed);
  });
}

/**
 * Static values in closed form (V = 0 in the cubic): v_j0 = (2 eta_p P / ((1 + K_n) rho A))^(1/3),
 * T0 = rho A v_j0^2 = (2 eta_p P / (1 + K_n))^(2/3) (rho A)^(1/3). Inlet loss and wake drop out.
 */
export function computeStaticPerformance(setup: JetSetupInput | PreparedJetSetup): StaticPerformance {
  const s = prepareJetSetup(setup);
  const jetVelocityMs = Math.cbrt(s.q);
  const massFlowKgS = s.rhoAreaKgM * jetVelocityMs;
  return { jetVelocityMs, massFlowKgS, thrustN: massFlowKgS * jetVelocityMs };
}

export interface NozzleForThrustInput extends JetModelAssumptions {
  targetStaticThrustN: number;
  powerKw: number;
}

/**
 * Invert the static thrust for the nozzle: rho A = T0^3 (1 + K_n)^2 / (2 eta_p P)^2,
 * D = sqrt(4 A / pi). Returns millimetres.
 */
export function computeNozzleDiameterForStaticThrustMm(input: NozzleForThrustInput): number {
  const t0 = assertPositive('targetStaticThrustN', input.targetStaticThrustN);
  // Reuse the set-up validation for power, density, efficiency and losses (diameter is a dummy).
  const s = prepareJetSetup({ ...input, nozzleDiameterMm: 1 });
  const twoEtaP = 2 * s.pumpEfficiency * s.powerKw * 1000;
  const onePlusKn = 1 + s.nozzleLossCoefficient;
  const areaM2 = (t0 * t0 * t0 * onePlusKn * onePlusKn) / (s.densityKgM3 * twoEtaP * twoEtaP);
  const diameterMm = Math.sqrt((4 * areaM2) / Math.PI) * 1000;
  if (!Number.isFinite(diameterMm) || diameterMm <= 0) {
    throw new EngineInputError('targetStaticThrustN', 'Target thrust gives no finite nozzle diameter');
  }
  return diameterMm;
}

/**
 * Thrust-best jet-to-boat velocity ratio with losses, NVR* = 1 + sqrt((K_i + K_n)/(1 + K_n))
 * (from the power balance above, as stated in the project's domain brief; lossless: 1).
 */
export function computeOptimalVelocityRatio(nozzleLossCoefficient: number, inletLossCoefficient: number): number {
  const kn = assertInHalfOpenRange('nozzleLossCoefficient', nozzleLossCoefficient, 0, 1);
  const ki = assertInHalfOpenRange('inletLossCoefficient', inletLossCoefficient, 0, 1);
  return 1 + Math.sqrt((ki + kn) / (1 + kn));
}
