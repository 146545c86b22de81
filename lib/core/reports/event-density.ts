import { resolveDensity, ITTC_TEMPERATURE_RANGE_C, type ResolvedDensity } from '../engine/water';

/**
 * The water density a meeting's parity figures use: the organiser's override if set; else the
 * ITTC 7.5-02-01-03 table for 10–25 °C, or UNESCO EOS-80 outside that range (one basis per report).
 */
export function resolveEventDensity(e: {
  waterKind: 'fresh' | 'sea';
  waterTemperatureC: number;
  waterDensityKgM3: number | null;
}): ResolvedDensity {
  if (e.waterDensityKgM3 != null) return resolveDensity({ densityKgM3: e.waterDensityKgM3 });
  const inIttc =
    e.waterTemperatureC >= ITTC_TEMPERATURE_RANGE_C.min && e.waterTemperatureC <= ITTC_TEMPERATURE_RANGE_C.max;
  return resolveDensity({ kind: e.waterKind, temperatureC: e.waterTemperatureC, basis: inIttc ? 'ittc' : 'eos80' });
}
