// A boat's declared engine and pump data as the engine reads it, and in words for declaration changes.
// Pure: runs on the server, in tests and the browser.

import type { StoredBoatPerformance } from '../../../models/shapes/boat-performance';
import { buildRatedEngineCurve } from '../engine/engine-curve-shapes';
import type { MatchedSetupInput } from '../engine/jet-matched';

export type { StoredBoatPerformance };

/** The engine and pump halves of a matched set-up, or null when either is missing. */
export function matchedCurvesOf(
  p: StoredBoatPerformance | null | undefined,
): Pick<MatchedSetupInput, 'engine' | 'pump'> | null {
  if (!p?.engine || !p.pump) return null;
  const e = p.engine;
  const engine =
    e.kind === 'points'
      ? { curve: e.curve, ...(e.limiterRpm !== undefined && { limiterRpm: e.limiterRpm }) }
      : {
          curve: buildRatedEngineCurve(e.ratedPowerKw, e.ratedRpm, e.shape),
          ...(e.limiterRpm !== undefined && { limiterRpm: e.limiterRpm }),
        };
  return { engine, pump: { impellerDiameterMm: p.pump.impellerDiameterMm, curve: p.pump.curve } };
}

/** One line for the declaration history and the re-inspection notice. */
export function describePerformance(p: StoredBoatPerformance | null | undefined): string {
  if (!p || (!p.engine && !p.pump && !p.suction)) return '(none)';
  const parts: string[] = [];
  const e = p.engine;
  if (e)
    parts.push(
      e.kind === 'points'
        ? `engine curve ${e.curve.length} points to ${e.curve[e.curve.length - 1].rpm} rpm`
        : `engine ${e.ratedPowerKw} kW at ${e.ratedRpm} rpm (${e.shape.replace('_', ' ')})`,
    );
  const q = p.pump;
  if (q)
    parts.push(
      q.kind === 'points'
        ? `pump curve ${q.curve.length} points, impeller ${q.impellerDiameterMm} mm`
        : `pump ${q.maker} ${q.model}${q.trimCode ? ` trim ${q.trimCode}` : ''}`,
    );
  if (p.suction) parts.push(`inlet ${p.suction.inletDepthM} m deep`);
  return parts.join(', ');
}

/** Key order fixed, so two equal declarations compare equal as text. */
export function canonicalPerformance(p: StoredBoatPerformance | null | undefined): string {
  if (!p) return 'null';
  const sort = (v: unknown): unknown =>
    Array.isArray(v)
      ? v.map(sort)
      : v && typeof v === 'object'
        ? Object.fromEntries(
            Object.keys(v as object)
              .sort()
              .map((k) => [k, sort((v as Record<string, unknown>)[k])]),
          )
        : v;
  return JSON.stringify(sort(p));
}
