// The nozzle's temperature correction and uncertainty budget as the verdict uses them: which
// temperatures and materials were recorded (or assumed, said in words), the corrected readings, and
// the budget of the decisive reading. Framework-free, like decide-inspection.ts that calls it.
//
// Decided here (issue 16): a record that gives only the nozzle's temperature (the older temperatureC,
// or partTemperatureC alone) keeps today's meaning: the part at that temperature, the instrument taken
// as at 20 °C. Its corrected readings are what they were; its budget now carries the temperature terms,
// with the instrument's temperature stated as assumed. The instrument's material comes from the
// instrument when it has one on file, else from the form, else steel is assumed (most calipers and bore
// gauges) and the record says so.

import { THERMAL_EXPANSION_PER_K, MATERIAL_OPTIONS, type Material } from '../engine/measurement';
import {
  REFERENCE_TEMPERATURE_C,
  computeLengthBudget,
  correctDifferentialExpansionMm,
  type LengthBudget,
  type ReadingUncertaintyTerm,
} from '../engine/measurement-thermal';

export type InstrumentTemperatureSource = 'measured' | 'same_as_part' | 'assumed_reference';
export type InstrumentMaterialSource = 'instrument' | 'form' | 'assumed_steel';

export type NozzleThermalInput = {
  temperatureC: number | null;
  partTemperatureC?: number | null;
  instrumentTemperatureC?: number | null;
  instrumentAtPartTemperature?: boolean;
  material: Material | null;
  instrumentMaterial?: Material | null;
};

export type NozzleThermal = {
  partTemperatureC: number;
  instrumentTemperatureC: number;
  instrumentTemperatureSource: InstrumentTemperatureSource;
  partMaterial: Material;
  instrumentMaterial: Material;
  instrumentMaterialSource: InstrumentMaterialSource;
};

const isMaterial = (m: unknown): m is Material =>
  typeof m === 'string' && Object.prototype.hasOwnProperty.call(THERMAL_EXPANSION_PER_K, m);
const words = (m: Material) => MATERIAL_OPTIONS.find((o) => o.value === m)?.label.toLowerCase() ?? m;

/** What the correction uses, or null when there is nothing to correct (no temperature or no nozzle material). */
export function resolveNozzleThermal(n: NozzleThermalInput, instrumentMaterial?: string | null): NozzleThermal | null {
  const part = n.partTemperatureC ?? n.temperatureC;
  if (part == null || n.material == null) return null;
  const [ti, tiSource]: [number, InstrumentTemperatureSource] = n.instrumentAtPartTemperature
    ? [part, 'same_as_part']
    : n.instrumentTemperatureC != null
      ? [n.instrumentTemperatureC, 'measured']
      : [REFERENCE_TEMPERATURE_C, 'assumed_reference'];
  const [mi, miSource]: [Material, InstrumentMaterialSource] = isMaterial(instrumentMaterial)
    ? [instrumentMaterial, 'instrument']
    : n.instrumentMaterial
      ? [n.instrumentMaterial, 'form']
      : ['steel', 'assumed_steel'];
  return {
    partTemperatureC: part,
    instrumentTemperatureC: ti,
    instrumentTemperatureSource: tiSource,
    partMaterial: n.material,
    instrumentMaterial: mi,
    instrumentMaterialSource: miSource,
  };
}

/** L20 of one reading (ISO 1:2022 reference temperature; the model in measurement-thermal.ts). */
export function correctReadingMm(lengthMm: number, t: NozzleThermal): number {
  return correctDifferentialExpansionMm({
    lengthMm,
    partTemperatureC: t.partTemperatureC,
    instrumentTemperatureC: t.instrumentTemperatureC,
    partExpansionPerK: THERMAL_EXPANSION_PER_K[t.partMaterial],
    instrumentExpansionPerK: THERMAL_EXPANSION_PER_K[t.instrumentMaterial],
  });
}

/** The sentence the verdict adds about the correction. */
export function describeThermal(t: NozzleThermal): string {
  const instrument =
    t.instrumentTemperatureSource === 'same_as_part'
      ? `at the same temperature`
      : t.instrumentTemperatureSource === 'measured'
        ? `at ${t.instrumentTemperatureC} °C`
        : `not measured, taken as at 20 °C`;
  const material =
    t.instrumentMaterialSource === 'assumed_steel'
      ? 'steel assumed'
      : `${words(t.instrumentMaterial)}${t.instrumentMaterialSource === 'instrument' ? ', from the instrument' : ''}`;
  return ` Readings corrected from ${t.partTemperatureC} °C to 20 °C (${words(t.partMaterial)}, ISO 1:2022), allowing for the instrument (${material}) ${instrument}: L20 = L·(1 + α_i(t_i − 20))/(1 + α_p(t_p − 20)) (JCGM 100:2008, H.1).`;
}

/**
 * The budget of the decisive reading: the instrument's terms (standard uncertainties of L) and, when
 * corrected, the temperature and expansion-coefficient terms (measurement-thermal.ts).
 */
export function nozzleBudget(
  readingTerms: ReadingUncertaintyTerm[],
  decisiveReadingMm: number,
  t: NozzleThermal | null,
): LengthBudget {
  const b = computeLengthBudget({
    readingTerms,
    thermal: t
      ? {
          lengthMm: decisiveReadingMm,
          partTemperatureC: t.partTemperatureC,
          instrumentTemperatureC: t.instrumentTemperatureC,
          partExpansionPerK: THERMAL_EXPANSION_PER_K[t.partMaterial],
          instrumentExpansionPerK: THERMAL_EXPANSION_PER_K[t.instrumentMaterial],
          sharedTemperature: t.instrumentTemperatureSource === 'same_as_part',
        }
      : null,
  });
  if (t?.instrumentTemperatureSource !== 'assumed_reference') return b;
  const terms = b.terms.map((x) =>
    x.quantity.startsWith('t_i')
      ? { ...x, basis: `not measured: taken as 20 °C within the thermometer’s ±1 °C, rectangular (an assumption)` }
      : x,
  );
  return { ...b, terms };
}
