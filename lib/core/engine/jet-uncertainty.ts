// First-order propagation of the standard uncertainties of shaft power and nozzle diameter
// (JCGM 100:2008, 5.1.2, uncorrelated inputs): u_c(y)^2 = sum (df/dx_i)^2 u(x_i)^2.
// Inputs and outputs are STANDARD uncertainties (k = 1); multiply by k = 2 for an expanded one.
//
// - Static values in closed form: T0 ∝ P^(2/3) D^(2/3), v_j0 ∝ P^(1/3) D^(-2/3), so
//   u(T0)/T0 = sqrt((2/3 u_D/D)^2 + (2/3 u_P/P)^2), u(v_j0)/v_j0 = sqrt((2/3 u_D/D)^2 + (1/3 u_P/P)^2).
// - At speed: sensitivity coefficients by central differences (JCGM 100:2008, 5.1.3 allows
//   numerical derivatives), relative step h = 6e-6 ≈ cbrt(machine epsilon), which balances the
//   O(h^2) truncation error against rounding; agreement with the closed form at V = 0 is tested.
// - Crossover speed V*: implicit function theorem on Δ(V*, x) = T_boat(V*) - T_ref(V*) = 0,
//   dV*/dx = -(∂T_boat/∂x) / (∂Δ/∂V); the reference set-up is held exact.
// - Equalising diameter at fixed target thrust: D ∝ P^(-1) (from rho A = T0^3 (1+K_n)^2/(2 eta P)^2),
//   so u(D_eq)/D_eq = u_P/P; the target (class median) is held exact.

import { assertNonNegative, assertPositive } from './engine-input-error';
import { evaluateJetVelocityMs, evaluateThrustN, prepareJetSetup, withPowerAndDiameter } from './jet';
import type { JetSetupInput, PreparedJetSetup } from './jet';

export interface InputUncertainties {
  /** Standard uncertainty of shaft power, kW (default 0). */
  uPowerKw?: number;
  /** Standard uncertainty of nozzle exit diameter, mm (default 0). */
  uNozzleDiameterMm?: number;
}

const RELATIVE_STEP = 6e-6;

function readUncertainties(u: InputUncertainties): { uPowerKw: number; uDiameterMm: number } {
  return {
    uPowerKw: assertNonNegative('uPowerKw', u.uPowerKw ?? 0),
    uDiameterMm: assertNonNegative('uNozzleDiameterMm', u.uNozzleDiameterMm ?? 0),
  };
}

export interface StaticUncertainty {
  uStaticThrustN: number;
  uStaticJetVelocityMs: number;
  relativeUStaticThrust: number;
  relativeUStaticJetVelocity: number;
}

/** Closed-form propagation for the static values (see header). */
export function computeStaticUncertainty(
  setup: JetSetupInput | PreparedJetSetup,
  u: InputUncertainties,
): StaticUncertainty {
  const s = prepareJetSetup(setup);
  const { uPowerKw, uDiameterMm } = readUncertainties(u);
  const relP = uPowerKw / s.powerKw;
  const relD = uDiameterMm / s.nozzleDiameterMm;
  const v0 = Math.cbrt(s.q);
  const t0 = s.rhoAreaKgM * v0 * v0;
  const relativeUStaticThrust = Math.hypot((2 / 3) * relD, (2 / 3) * relP);
  const relativeUStaticJetVelocity = Math.hypot((2 / 3) * relD, (1 / 3) * relP);
  return {
    uStaticThrustN: relativeUStaticThrust * t0,
    uStaticJetVelocityMs: relativeUStaticJetVelocity * v0,
    relativeUStaticThrust,
    relativeUStaticJetVelocity,
  };
}

export interface SpeedSensitivity {
  /** ∂T/∂P, N per kW. */
  thrustPerPowerNPerKw: number;
  /** ∂T/∂D, N per mm. */
  thrustPerDiameterNPerMm: number;
  /** ∂v_j/∂P, (m/s) per kW. */
  jetVelocityPerPowerMsPerKw: number;
  /** ∂v_j/∂D, (m/s) per mm. */
  jetVelocityPerDiameterMsPerMm: number;
}

export interface ThrustSensitivity {
  readonly setup: PreparedJetSetup;
  /** Sensitivity coefficients at one boat speed; allocation of one small result object. */
  atSpeed(speedMs: number): SpeedSensitivity;
}

/** Prepares the four perturbed set-ups once, so many speeds cost four cubic solves each. */
export function createThrustSensitivity(setup: JetSetupInput | PreparedJetSetup): ThrustSensitivity {
  const s = prepareJetSetup(setup);
  const hP = RELATIVE_STEP * s.powerKw;
  const hD = RELATIVE_STEP * s.nozzleDiameterMm;
  const pUp = withPowerAndDiameter(s, s.powerKw + hP, s.nozzleDiameterMm);
  const pDown = withPowerAndDiameter(s, s.powerKw - hP, s.nozzleDiameterMm);
  const dUp = withPowerAndDiameter(s, s.powerKw, s.nozzleDiameterMm + hD);
  const dDown = withPowerAndDiameter(s, s.powerKw, s.nozzleDiameterMm - hD);
  return {
    setup: s,
    atSpeed(speedMs: number): SpeedSensitivity {
      return {
        thrustPerPowerNPerKw: (evaluateThrustN(pUp, speedMs) - evaluateThrustN(pDown, speedMs)) / (2 * hP),
        thrustPerDiameterNPerMm: (evaluateThrustN(dUp, speedMs) - evaluateThrustN(dDown, speedMs)) / (2 * hD),
        jetVelocityPerPowerMsPerKw:
          (evaluateJetVelocityMs(pUp, speedMs) - evaluateJetVelocityMs(pDown, speedMs)) / (2 * hP),
        jetVelocityPerDiameterMsPerMm:
          (evaluateJetVelocityMs(dUp, speedMs) - evaluateJetVelocityMs(dDown, speedMs)) / (2 * hD),
      };
    },
  };
}

export interface SpeedUncertainty {
  speedMs: number;
  thrustN: number;
  uThrustN: number;
  jetVelocityMs: number;
  uJetVelocityMs: number;
}

export function computeUncertaintyAtSpeed(
  sensitivity: ThrustSensitivity,
  speedMs: number,
  u: InputUncertainties,
): SpeedUncertainty {
  const { uPowerKw, uDiameterMm } = readUncertainties(u);
  const c = sensitivity.atSpeed(speedMs);
  return {
    speedMs,
    thrustN: evaluateThrustN(sensitivity.setup, speedMs),
    uThrustN: Math.hypot(c.thrustPerPowerNPerKw * uPowerKw, c.thrustPerDiameterNPerMm * uDiameterMm),
    jetVelocityMs: evaluateJetVelocityMs(sensitivity.setup, speedMs),
    uJetVelocityMs: Math.hypot(c.jetVelocityPerPowerMsPerKw * uPowerKw, c.jetVelocityPerDiameterMsPerMm * uDiameterMm),
  };
}

/** Convenience: thrust and jet velocity with their standard uncertainties at one speed. */
export function computeThrustUncertaintyAtSpeed(
  setup: JetSetupInput | PreparedJetSetup,
  speedMs: number,
  u: InputUncertainties,
): SpeedUncertainty {
  return computeUncertaintyAtSpeed(createThrustSensitivity(setup), speedMs, u);
}

/**
 * Standard uncertainty of a crossover speed from the boat's own power and diameter (reference
 * exact). null when the curves meet tangentially (∂Δ/∂V ≈ 0: first order gives no finite answer).
 */
export function computeCrossoverUncertaintyMs(
  sensitivity: ThrustSensitivity,
  reference: JetSetupInput | PreparedJetSetup,
  crossoverSpeedMs: number,
  u: InputUncertainties,
): number | null {
  const { uPowerKw, uDiameterMm } = readUncertainties(u);
  const ref = prepareJetSetup(reference);
  const v = crossoverSpeedMs;
  const h = Math.min(RELATIVE_STEP * Math.max(v, 1), v / 2);
  const diff = (speed: number) => evaluateThrustN(sensitivity.setup, speed) - evaluateThrustN(ref, speed);
  const slope = (diff(v + h) - diff(v - h)) / (2 * h);
  const scale = Math.abs(evaluateThrustN(ref, v)) + Math.abs(evaluateThrustN(sensitivity.setup, v));
  if (!(Math.abs(slope) > 1e-9 * (scale + 1))) return null;
  const c = sensitivity.atSpeed(v);
  const u2 = Math.hypot((c.thrustPerPowerNPerKw / slope) * uPowerKw, (c.thrustPerDiameterNPerMm / slope) * uDiameterMm);
  return Number.isFinite(u2) ? u2 : null;
}

/** u(D_eq) = D_eq u_P / P (see header), mm. */
export function computeEqualisingDiameterUncertaintyMm(
  equalisingDiameterMm: number,
  powerKw: number,
  uPowerKw: number,
): number {
  const d = assertPositive('equalisingDiameterMm', equalisingDiameterMm);
  return (d * assertNonNegative('uPowerKw', uPowerKw)) / assertPositive('powerKw', powerKw);
}
