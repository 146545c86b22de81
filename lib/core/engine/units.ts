// Unit conversion for the quantities the product shows. Engine functions work in SI
// (W, m, kg, N, m/s, degrees C); these helpers sit at the edges (forms, reports).
// Exact factors from NIST SP 811 (2008), appendix B; km/h is exact by definition.

import { EngineInputError, assertFiniteNumber } from './engine-input-error';

/** NIST SP 811 (2008) appendix B factors, value of one unit in SI. */
export const NIST_SP811 = {
  horsepowerW: 745.69987158227022, // hp (550 ft lbf/s)
  metricHorsepowerW: 735.49875, // PS
  inchM: 0.0254,
  poundKg: 0.45359237, // lb (avoirdupois)
  poundForceN: 4.4482216152605, // lbf
  kilogramForceN: 9.80665, // kgf (standard gravity)
  knotMs: 1852 / 3600, // kn (international nautical mile per hour)
  milePerHourMs: 0.44704, // mph
} as const;

export type PowerUnit = 'W' | 'kW' | 'hp' | 'PS';
export type LengthUnit = 'mm' | 'm' | 'in';
export type MassUnit = 'kg' | 'lb';
export type ForceUnit = 'N' | 'lbf' | 'kgf';
export type SpeedUnit = 'm/s' | 'km/h' | 'kn' | 'mph';
export type TemperatureUnit = 'C' | 'F';

export interface UnitsByQuantity {
  power: PowerUnit;
  length: LengthUnit;
  mass: MassUnit;
  force: ForceUnit;
  speed: SpeedUnit;
  temperature: TemperatureUnit;
}
export type Quantity = keyof UnitsByQuantity;
export type AnyUnit = UnitsByQuantity[Quantity];
/** The quantity a unit belongs to (unit names are unique across quantities). */
export type QuantityOf<U extends AnyUnit> = {
  [Q in Quantity]: U extends UnitsByQuantity[Q] ? Q : never;
}[Quantity];
/** Units that measure the same quantity as U. */
export type SameQuantityUnit<U extends AnyUnit> = UnitsByQuantity[QuantityOf<U>];

// Value of one unit in the SI base of its quantity (temperature is affine, handled apart).
const LINEAR_FACTORS = {
  power: { W: 1, kW: 1000, hp: NIST_SP811.horsepowerW, PS: NIST_SP811.metricHorsepowerW },
  length: { mm: 0.001, m: 1, in: NIST_SP811.inchM },
  mass: { kg: 1, lb: NIST_SP811.poundKg },
  force: { N: 1, lbf: NIST_SP811.poundForceN, kgf: NIST_SP811.kilogramForceN },
  speed: { 'm/s': 1, 'km/h': 1 / 3.6, kn: NIST_SP811.knotMs, mph: NIST_SP811.milePerHourMs },
} as const satisfies { [Q in Exclude<Quantity, 'temperature'>]: Record<UnitsByQuantity[Q], number> };

export const UNIT_LABELS: Record<AnyUnit, string> = {
  W: 'W',
  kW: 'kW',
  hp: 'hp',
  PS: 'PS',
  mm: 'mm',
  m: 'm',
  in: 'in',
  kg: 'kg',
  lb: 'lb',
  N: 'N',
  lbf: 'lbf',
  kgf: 'kgf',
  'm/s': 'm/s',
  'km/h': 'km/h',
  kn: 'kn',
  mph: 'mph',
  C: '°C',
  F: '°F',
};

const UNIT_QUANTITY: Record<AnyUnit, Quantity> = {
  W: 'power',
  kW: 'power',
  hp: 'power',
  PS: 'power',
  mm: 'length',
  m: 'length',
  in: 'length',
  kg: 'mass',
  lb: 'mass',
  N: 'force',
  lbf: 'force',
  kgf: 'force',
  'm/s': 'speed',
  'km/h': 'speed',
  kn: 'speed',
  mph: 'speed',
  C: 'temperature',
  F: 'temperature',
};

export interface UnitOption<U extends AnyUnit> {
  value: U;
  label: string;
}
function toOptions<U extends AnyUnit>(units: readonly U[]): readonly UnitOption<U>[] {
  return units.map((value) => ({ value, label: UNIT_LABELS[value] }));
}

/** Option lists for unit pickers; the first entry is the product default. */
export const POWER_UNIT_OPTIONS = toOptions<PowerUnit>(['kW', 'hp', 'PS', 'W']);
export const LENGTH_UNIT_OPTIONS = toOptions<LengthUnit>(['mm', 'in', 'm']);
export const MASS_UNIT_OPTIONS = toOptions<MassUnit>(['kg', 'lb']);
export const FORCE_UNIT_OPTIONS = toOptions<ForceUnit>(['N', 'kgf', 'lbf']);
export const SPEED_UNIT_OPTIONS = toOptions<SpeedUnit>(['km/h', 'm/s', 'kn', 'mph']);
export const TEMPERATURE_UNIT_OPTIONS = toOptions<TemperatureUnit>(['C', 'F']);

export function isUnit(value: unknown): value is AnyUnit {
  return typeof value === 'string' && Object.prototype.hasOwnProperty.call(UNIT_QUANTITY, value);
}

export function getQuantityOfUnit(unit: AnyUnit): Quantity {
  if (!isUnit(unit)) throw new EngineInputError('unit', `Unknown unit "${String(unit)}"`);
  return UNIT_QUANTITY[unit];
}

const ABSOLUTE_ZERO_C = -273.15;

function toCelsius(value: number, unit: TemperatureUnit): number {
  return unit === 'C' ? value : ((value - 32) * 5) / 9;
}
function fromCelsius(valueC: number, unit: TemperatureUnit): number {
  return unit === 'C' ? valueC : (valueC * 9) / 5 + 32;
}

/**
 * Convert between two units of the same quantity, e.g. convert(300, 'kW', 'hp').
 * The type of `to` is narrowed to the quantity of `from`; a runtime check guards untyped callers.
 */
export function convert<U extends AnyUnit>(value: number, from: U, to: SameQuantityUnit<U>): number {
  const x = assertFiniteNumber('value', value);
  const quantity = getQuantityOfUnit(from);
  const toUnit = to as AnyUnit;
  if (!isUnit(toUnit) || UNIT_QUANTITY[toUnit] !== quantity) {
    throw new EngineInputError('to', `Cannot convert ${quantity} from ${from} to ${String(to)}`);
  }
  if (from === toUnit) return x;
  if (quantity === 'temperature') {
    const c = toCelsius(x, from as TemperatureUnit);
    if (c < ABSOLUTE_ZERO_C - 1e-9) {
      throw new EngineInputError('value', `Temperature ${x} ${UNIT_LABELS[from]} is below absolute zero`);
    }
    return fromCelsius(c, toUnit as TemperatureUnit);
  }
  const table = LINEAR_FACTORS[quantity] as Record<string, number>;
  return (x * table[from]) / table[toUnit];
}

// Per-quantity wrappers: clearer at call sites and in autocomplete.
export const convertPower = (value: number, from: PowerUnit, to: PowerUnit): number => convert(value, from, to);
export const convertLength = (value: number, from: LengthUnit, to: LengthUnit): number => convert(value, from, to);
export const convertMass = (value: number, from: MassUnit, to: MassUnit): number => convert(value, from, to);
export const convertForce = (value: number, from: ForceUnit, to: ForceUnit): number => convert(value, from, to);
export const convertSpeed = (value: number, from: SpeedUnit, to: SpeedUnit): number => convert(value, from, to);
export const convertTemperature = (value: number, from: TemperatureUnit, to: TemperatureUnit): number =>
  convert(value, from, to);

export interface FormatQuantityOptions {
  /** Fixed number of decimals (default 2). */
  fractionDigits?: number;
  /** BCP 47 locale for grouping and decimal mark; default: plain `toFixed` (stable in tests). */
  locale?: string;
}

/** "402.31 hp", "15.0 °C". Non-finite values print as an em dash so a UI never shows "NaN". */
export function formatQuantity(value: number, unit: AnyUnit, options: FormatQuantityOptions = {}): string {
  getQuantityOfUnit(unit); // refuses unknown units
  const label = UNIT_LABELS[unit];
  if (!Number.isFinite(value)) return `— ${label}`;
  const digits = options.fractionDigits ?? 2;
  const text = options.locale
    ? value.toLocaleString(options.locale, { minimumFractionDigits: digits, maximumFractionDigits: digits })
    : value.toFixed(digits);
  return `${text} ${label}`;
}
