// The calculator's set-ups as typed (text in the units the person chose), turned into public API
// bodies in SI, and the API's field errors mapped back to the fields they came from.
// Plain TypeScript: no React, so the rules stay readable in one place.

import { convertForce, convertLength, convertPower, convertSpeed, formatQuantity } from '@/lib/core/engine/units';
import type { ForceUnit, PowerUnit, SpeedUnit } from '@/lib/core/engine/units';
import { ITTC_TEMPERATURE_RANGE_C } from '@/lib/core/engine/water';

export const MAX_SETUPS = 4;
/** Chart and curve speeds: 0 to 35 m/s (126 km/h) in 0.5 m/s steps, covering sprint boats. */
export const CURVE_SPEEDS_MS = Array.from({ length: 71 }, (_, i) => i * 0.5);

export type InputPowerUnit = Extract<PowerUnit, 'kW' | 'hp' | 'PS'>;
export type InputLengthUnit = 'mm' | 'in';

export interface SetupDraft {
  id: string;
  label: string;
  power: string;
  powerUnit: InputPowerUnit;
  nozzle: string;
  nozzleUnit: InputLengthUnit;
  pumpEfficiency: string;
  nozzleLoss: string;
  inletLoss: string;
  waterKind: 'fresh' | 'sea';
  temperatureC: string;
  /** Blank: the density comes from water kind and temperature. */
  densityKgM3: string;
}

export type SetupField =
  'power' | 'nozzle' | 'pumpEfficiency' | 'nozzleLoss' | 'inletLoss' | 'waterKind' | 'temperatureC' | 'densityKgM3';
export type FieldErrors = Partial<Record<SetupField, string>>;

export interface DisplayUnits {
  power: PowerUnit;
  speed: SpeedUnit;
  force: ForceUnit;
}

/**
 * Typical values so the page opens with a real curve: pump efficiency about 0.85–0.92, flush inlet loss
 * K_i about 0.1–0.3, nozzle loss K_n about 0.01–0.05 (MIT 2.611 course notes use K_i = 0.2, eta_p = 0.9;
 * the ranges are common practice [partly memory]).
 */
export function createExampleSetup(id: string, label: string): SetupDraft {
  return {
    id,
    label,
    power: '250',
    powerUnit: 'kW',
    nozzle: '95',
    nozzleUnit: 'mm',
    pumpEfficiency: '0.88',
    nozzleLoss: '0.03',
    inletLoss: '0.2',
    waterKind: 'fresh',
    temperatureC: '15',
    densityKgM3: '',
  };
}

/** The next unused letter, A to D. */
export function nextLabel(setups: readonly SetupDraft[]): string {
  return ['A', 'B', 'C', 'D', 'E'].find((l) => !setups.some((s) => s.label === l)) ?? `Set-up ${setups.length + 1}`;
}

/**
 * Text to number. Blank gives undefined (the API default applies, or the API names the missing
 * field); a decimal comma is accepted; anything else that is not a number stays NaN, which JSON
 * sends as null, so the API reports it beside the field instead of us guessing.
 */
function parseNumber(text: string): number | undefined {
  const t = text.trim().replace(',', '.');
  return t === '' ? undefined : Number(t);
}

const finiteOr = <T>(x: number | undefined, f: (v: number) => T): T | number | undefined =>
  x !== undefined && Number.isFinite(x) ? f(x) : x;

/** The jet model part of an API body (everything but the nozzle diameter and the speeds). */
export function toModelBody(s: SetupDraft) {
  const densityKgM3 = parseNumber(s.densityKgM3);
  return {
    powerKw: finiteOr(parseNumber(s.power), (v) => convertPower(v, s.powerUnit, 'kW')),
    pumpEfficiency: parseNumber(s.pumpEfficiency),
    nozzleLossCoefficient: parseNumber(s.nozzleLoss),
    inletLossCoefficient: parseNumber(s.inletLoss),
    // A density override replaces the water entirely, so a blank temperature is then no error.
    ...(densityKgM3 !== undefined
      ? { densityKgM3 }
      : { water: { kind: s.waterKind, temperatureC: parseNumber(s.temperatureC) ?? Number.NaN } }),
  };
}

export function toNozzleDiameterMm(s: SetupDraft): number | undefined {
  return finiteOr(parseNumber(s.nozzle), (v) => convertLength(v, s.nozzleUnit, 'mm')) as number | undefined;
}

export type ModelBody = ReturnType<typeof toModelBody>;

/** Same power, water and losses: only then can the crossover API compare the two nozzles. */
export function hasSameModel(a: ModelBody, b: ModelBody): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

const API_FIELDS: Record<string, SetupField> = {
  powerKw: 'power',
  nozzleDiameterMm: 'nozzle',
  'nozzleDiametersMm.0': 'nozzle',
  'nozzleDiametersMm.1': 'nozzle',
  pumpEfficiency: 'pumpEfficiency',
  nozzleLossCoefficient: 'nozzleLoss',
  inletLossCoefficient: 'inletLoss',
  water: 'waterKind',
  'water.kind': 'waterKind',
  'water.temperatureC': 'temperatureC',
  densityKgM3: 'densityKgM3',
};

/** Each field as the form labels it, so a message names what the person sees. */
export const FIELD_LABELS: Record<SetupField, string> = {
  power: 'Shaft power',
  nozzle: 'Nozzle exit diameter',
  pumpEfficiency: 'Pump efficiency',
  nozzleLoss: 'Nozzle loss coefficient Kₙ',
  inletLoss: 'Inlet loss coefficient Kᵢ',
  waterKind: 'Water',
  temperatureC: 'Water temperature',
  densityKgM3: 'Density override',
};

const FIELD_EXAMPLES: Partial<Record<SetupField, string>> = {
  power: '250',
  nozzle: '95',
  pumpEfficiency: '0.88',
  nozzleLoss: '0.03',
  inletLoss: '0.2',
  temperatureC: '15',
  densityKgM3: '1000',
};

/** The water temperatures the ITTC table covers (the same range the API enforces): the hint and the message use it. */
export const WATER_TEMPERATURE_HINT = `${ITTC_TEMPERATURE_RANGE_C.min}–${ITTC_TEMPERATURE_RANGE_C.max} °C (ITTC table); outside it, enter a density.`;

/**
 * The API speaks to programs ("powerKw must be greater than 0", "expected a number"); the form
 * speaks to people: the field's label, what is wrong, and what to type instead.
 */
export function humanMessage(field: SetupField, apiMessage: string): string {
  const label = FIELD_LABELS[field];
  if (/must be a number|expected number|received/i.test(apiMessage)) {
    return `${label} must be a number${FIELD_EXAMPLES[field] ? `, for example ${FIELD_EXAMPLES[field]}` : ''}.`;
  }
  if (field === 'temperatureC') {
    const { min, max } = ITTC_TEMPERATURE_RANGE_C;
    return `Water temperature must be between ${min} and ${max} °C (the ITTC water table); for colder or warmer water, enter a density override.`;
  }
  if (/greater than 0|above 0/.test(apiMessage)) return `${label} must be greater than 0.`;
  // Other limits: keep the API's wording but name the field as the form does.
  const rest = apiMessage.replace(/^[A-Za-z.]+(?: \([^)]*\))? /, '');
  return `${label} ${rest}${/[.!]$/.test(rest) ? '' : '.'}`;
}

/** The API's field errors (its dotted field -> message, from requestJson) per set-up field (first message wins), in the form's words. */
export function toFieldErrors(apiErrors: Record<string, string>): FieldErrors {
  const out: FieldErrors = {};
  for (const [apiField, message] of Object.entries(apiErrors)) {
    const field = API_FIELDS[apiField];
    if (field) out[field] ??= humanMessage(field, message);
  }
  return out;
}

// Display: fixed decimals suited to each unit, so the figures do not jump while typing.
const FORCE_DIGITS: Record<ForceUnit, number> = { N: 0, kgf: 1, lbf: 0 };

export const formatForce = (n: number, unit: ForceUnit) =>
  formatQuantity(convertForce(n, 'N', unit), unit, { fractionDigits: FORCE_DIGITS[unit] });
export const formatSpeed = (ms: number, unit: SpeedUnit) =>
  formatQuantity(convertSpeed(ms, 'm/s', unit), unit, { fractionDigits: 1 });
export const formatPower = (kw: number, unit: PowerUnit) =>
  formatQuantity(convertPower(kw, 'kW', unit), unit, { fractionDigits: unit === 'W' ? 0 : 1 });

/** "33.5 m/s (120.6 km/h)": the chosen unit first, then m/s (or km/h when m/s is chosen). */
export function formatSpeedPair(ms: number, unit: SpeedUnit): string {
  const other: SpeedUnit = unit === 'm/s' ? 'km/h' : 'm/s';
  return `${formatSpeed(ms, unit)} (${formatSpeed(ms, other)})`;
}

export interface CurvePoint {
  speedMs: number;
  thrustN: number;
}

/** Thrust at a speed between sampled points (linear), for placing a marker on the chart. */
export function interpolateThrustN(points: readonly CurvePoint[], speedMs: number): number | undefined {
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    if (speedMs >= a.speedMs && speedMs <= b.speedMs) {
      const f = b.speedMs === a.speedMs ? 0 : (speedMs - a.speedMs) / (b.speedMs - a.speedMs);
      return a.thrustN + f * (b.thrustN - a.thrustN);
    }
  }
  return undefined;
}

/**
 * Where two sampled curves first change order (linear interpolation of the difference), or null.
 * Used only for set-ups the crossover API cannot compare (different power, water or losses).
 */
export function findCurveCrossingMs(a: readonly CurvePoint[], b: readonly CurvePoint[]): number | null {
  const n = Math.min(a.length, b.length);
  let prev = a[0].thrustN - b[0].thrustN;
  for (let i = 1; i < n; i++) {
    const d = a[i].thrustN - b[i].thrustN;
    if (prev !== 0 && Math.sign(d) !== Math.sign(prev)) {
      const f = prev / (prev - d);
      return a[i - 1].speedMs + f * (a[i].speedMs - a[i - 1].speedMs);
    }
    prev = d;
  }
  return null;
}
