// One place that knows how many digits each kind of figure deserves on a screen, in a CSV or in a
// pre-filled field. Framework-free (no imports): runs on the server, in the browser and in tests.
// Values are stored at full precision; only what is shown is rounded.
//
// Rounding: to the nearest multiple of the quantity's step, a tie going away from zero, applied
// to the exact binary value (ECMA-262 Number.prototype.toFixed, the "larger multiple" rule B of
// ISO 80000-1:2009 Annex B [memory for the annex's lettering]). 0.25 kW shows as 0.3 kW; 0.35,
// which is 0.34999… as a double, shows as 0.3.

export const FIGURES = {
  // A dyno sheet or a maker's rating is good to about 1 %; 0.1 kW keeps a declared 530 hp
  // (395.22… kW) readable and distinguishes it from 531 hp (395.97… kW).
  powerKw: { unit: 'kW', digits: 1 },
  // Power declared in hp or PS is a whole-number rating on the maker's sheet: 0.1 still shows a
  // figure converted back from kW (kW → hp) close to the rating without inventing digits.
  powerHp: { unit: 'hp', digits: 1 },
  powerPs: { unit: 'PS', digits: 1 },
  // Nozzle exit diameters: a caliper or bore gauge at the dock resolves 0.01 mm.
  nozzleMm: { unit: 'mm', digits: 2 },
  // An expanded uncertainty U in mm is itself a small figure (0.02–0.1 mm): one more digit than
  // the readings, so U of a 0.01 mm instrument (0.0115 mm) is not shown as 0.01.
  uncertaintyMm: { unit: 'mm', digits: 3 },
  // Other lengths (hulls, intakes) are read off a tape: 1 mm.
  lengthMm: { unit: 'mm', digits: 0 },
  // A platform scale for boats resolves 0.1 kg at best (often 0.5 kg).
  massKg: { unit: 'kg', digits: 1 },
  // Thrust from the engine's model carries a few per cent of uncertainty: whole newtons are plenty.
  forceN: { unit: 'N', digits: 0 },
  // Speeds from a model or a GPS log: 0.1 in each unit is finer than either can tell apart.
  speedMs: { unit: 'm/s', digits: 1 },
  speedKmh: { unit: 'km/h', digits: 1 },
  speedKn: { unit: 'kn', digits: 1 },
  // A contact thermometer on a nozzle reads to 0.1 °C.
  temperatureC: { unit: '°C', digits: 1 },
  // Reading angles around a nozzle exit are set by eye: whole degrees.
  angleDeg: { unit: '°', digits: 0 },
  // A class's own measured items (lib/core/engine/measured-item.ts): engine capacity from bore and
  // stroke to 0.1 cm³, tank volume to 0.01 L, fuel density to 0.1 kg/m³ (a hydrometer's scale), and a
  // sound level meter's 0.1 dB display (common practice, no source).
  volumeCm3: { unit: 'cm³', digits: 1 },
  volumeL: { unit: 'L', digits: 2 },
  densityKgM3: { unit: 'kg/m³', digits: 1 },
  soundDbA: { unit: 'dB(A)', digits: 1 },
} as const satisfies Record<string, { unit: string; digits: number }>;

export type FigureKind = keyof typeof FIGURES;

/** The figure kind of a verdict line's unit (nozzle, weight, power and a class's measured items). */
export const RULE_UNIT_KINDS = {
  mm: 'nozzleMm',
  kg: 'massKg',
  kW: 'powerKw',
  'cm³': 'volumeCm3',
  L: 'volumeL',
  'kg/m³': 'densityKgM3',
  'dB(A)': 'soundDbA',
} as const satisfies Record<string, FigureKind>;

/** The value alone, rounded for its kind (for a pre-filled form field or a CSV cell): '395.2'. */
export function figureValue(value: number, kind: FigureKind): string {
  if (!Number.isFinite(value)) return '';
  const s = value.toFixed(FIGURES[kind].digits);
  // A negative value that rounds to zero is zero, not "-0.0".
  return /^-0(\.0+)?$/.test(s) ? s.slice(1) : s;
}

/** The value with its unit, rounded for its kind: formatFigure(395.22093, 'powerKw') → '395.2 kW'. */
export function formatFigure(value: number | null | undefined, kind: FigureKind, missing = '—'): string {
  if (value == null || !Number.isFinite(value)) return missing;
  const { unit } = FIGURES[kind];
  return unit === '°' ? `${figureValue(value, kind)}°` : `${figureValue(value, kind)} ${unit}`;
}

/** The value rounded for its kind, as a number (a CSV column that spreadsheets should read as a number). */
export function roundFigure(value: number, kind: FigureKind): number {
  return Number(figureValue(value, kind));
}
