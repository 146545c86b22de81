'use client';

// The calculator's second mode: the jet matched to its engine and pump. Everything is computed in
// the browser by the engine's pure function (matched-model.ts); nothing is sent anywhere.
// The chart is loaded lazily, as the fixed-power chart is.

import dynamic from 'next/dynamic';
import { useDeferredValue, useMemo, useRef, useState } from 'react';
import { SafetyNote } from '@/components/safety-note';
import type { MatchedPerformancePoint } from '@/lib/core/engine/calculation-api';
import { MatchedFields } from './matched-fields';
import {
  CAVITATION_WORDS,
  MATCHED_REFERENCE_SPEEDS_MS,
  cavitatingRanges,
  computeMatchedOutcome,
  createExampleMatched,
  describeSpeed,
} from './matched-model';
import type { MatchedDraft, MatchedFieldErrors, NoOperatingPoint } from './matched-model';

const MatchedChart = dynamic(() => import('./matched-chart').then((m) => m.MatchedChart), {
  ssr: false,
  loading: () => (
    <div className="flex h-80 w-full items-center justify-center text-ink-soft sm:h-96">Loading the chart…</div>
  ),
});

function describeRange(g: { fromMs: number; toMs: number }): string {
  if (g.fromMs === g.toMs) return describeSpeed(g.fromMs);
  const from = g.fromMs === 0 ? 'rest' : describeSpeed(g.fromMs);
  return `from ${from} to ${describeSpeed(g.toMs)}`;
}

function gapSentence(g: NoOperatingPoint): string {
  const curve = g.curve === 'engine' ? 'engine curve' : 'pump curve';
  return `No operating point ${describeRange(g)} (${curve}): ${g.message}.`;
}

export function MatchedMode() {
  const [draft, setDraft] = useState<MatchedDraft>(createExampleMatched);
  const nextKey = useRef(100);
  const newKey = (prefix: string) => `${prefix}${nextKey.current++}`;
  // Typing stays responsive: the sweep runs on the deferred draft.
  const deferred = useDeferredValue(draft);
  const outcome = useMemo(() => computeMatchedOutcome(deferred), [deferred]);
  const isUpdating = deferred !== draft;

  const errors: MatchedFieldErrors = outcome.ok ? {} : { ...outcome.fieldErrors };
  // A speed range without an operating point is said beside the curve it names, too.
  for (const g of outcome.gaps) errors[`${g.curve}.curve`] ??= gapSentence(g);

  const cavitating = outcome.ok ? cavitatingRanges(outcome.points) : [];

  return (
    <div className="space-y-6" data-testid="matched-mode">
      <p className="max-w-3xl text-ink-soft" data-testid="matched-illustrative">
        The curves filled in below are an illustrative, invented example (not a maker&apos;s data): replace them with
        your engine&apos;s power curve and your pump&apos;s characteristic.
      </p>
      <div className="grid gap-6 lg:grid-cols-2">
        <MatchedFields
          draft={draft}
          errors={errors}
          onChange={(patch) => setDraft((d) => ({ ...d, ...patch }))}
          newKey={newKey}
        />

        <section aria-labelledby="matched-heading" className="card min-w-0 space-y-4 self-start">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="matched-heading">Thrust at the operating point</h2>
            <p
              role="status"
              aria-live="polite"
              data-testid="matched-status"
              className="text-sm font-bold text-tide-600"
            >
              {isUpdating ? 'Updating…' : ''}
            </p>
          </div>
          {!outcome.ok && (
            <p className="field-error" data-testid="matched-problem">
              {outcome.message}
            </p>
          )}
          {outcome.gaps.length > 0 && (
            <ul className="space-y-1 text-fail-600" data-testid="matched-gaps">
              {outcome.gaps.map((g) => (
                <li key={`${g.curve}-${g.fromMs}`}>{gapSentence(g)}</li>
              ))}
            </ul>
          )}
          {outcome.ok && (
            <>
              <figure className={isUpdating ? 'opacity-70 transition-opacity' : 'transition-opacity'}>
                <MatchedChart points={outcome.points} fixed={outcome.fixed} cavitating={cavitating} />
                <figcaption className="text-sm text-ink-soft">
                  Solid: thrust with the engine and pump matched. Dashed: the fixed-power model at the same nozzle, with
                  the shaft power and pump efficiency of the operating point {describeSpeed(outcome.points[0].speedMs)}{' '}
                  ({outcome.points[0].shaftPowerKw.toFixed(1)} kW, η {outcome.points[0].pumpEfficiency.toFixed(3)}) held
                  at every speed, as the fixed-power mode assumes. With each point&apos;s own power and efficiency the
                  two models give the same thrust.
                  {cavitating.length > 0 && ` Shaded: ${CAVITATION_WORDS}.`}
                </figcaption>
              </figure>
              {outcome.withCavitation && (
                <p data-testid="matched-cavitation-summary">
                  {cavitating.length === 0
                    ? 'The inlet does not cavitate at any speed from 0 to 40 m/s with these inputs.'
                    : `The inlet cavitates ${cavitating.map(describeRange).join('; ')}: ${CAVITATION_WORDS}.`}
                </p>
              )}
              <PointsTable points={outcome.points} fixed={outcome.fixed} withCavitation={outcome.withCavitation} />
              <p className="text-sm text-ink-soft">
                Water density {outcome.densityKgM3.toFixed(1)} kg/m³. Speeds from 0 to 40 m/s in 0.5 m/s steps.
              </p>
            </>
          )}
          <SafetyNote />
          <p className="text-sm text-ink-soft" data-testid="matched-caution">
            Figures from an idealised model; the governing body&apos;s rules and licensed officials decide.
          </p>
        </section>
      </div>

      <section aria-labelledby="matched-meaning" className="max-w-3xl space-y-3">
        <h2 id="matched-meaning">How the matched figures are found</h2>
        <p>
          At each boat speed the engine turns the pump at the speed where the power the pump absorbs equals the power
          the engine gives at that speed (or the limiter holds it). The pump&apos;s head there must equal what the
          nozzle and inlet need to pass the flow. From that flow the jet velocity and the thrust follow by momentum
          theory, as in the fixed-power mode.
        </p>
        <p className="text-ink-soft">
          Hull drag, ventilation and transient running are left out. Where the inlet cavitates the pump cannot deliver
          the flow assumed, so the thrust shown there is an upper bound.
        </p>
        <h3>Sources of the model</h3>
        <ul className="list-disc space-y-1 pl-6 text-ink-soft">
          <li>Karassik et al., Pump Handbook, 4th ed. (2008): the pump affinity laws and NPSH available.</li>
          <li>Brennen, Hydrodynamics of Pumps (1994), section 1.7: the suction specific speed and NPSH required.</li>
          <li>
            Allison, &ldquo;Marine Waterjet Propulsion&rdquo;, SNAME Transactions 101 (1993): the momentum and power
            balance.
          </li>
          <li>Vapour pressure of water: IAPWS-IF97 (IAPWS, 2007 revision), region 4.</li>
        </ul>
      </section>
    </div>
  );
}

function PointsTable({
  points,
  fixed,
  withCavitation,
}: {
  points: readonly MatchedPerformancePoint[];
  fixed: readonly (number | undefined)[];
  withCavitation: boolean;
}) {
  return (
    <div className="max-w-full overflow-x-auto" data-testid="matched-table-wrap">
      <table
        className="w-full text-sm [&_td]:whitespace-nowrap [&_td]:px-2 [&_td]:py-1 [&_th]:whitespace-nowrap [&_th]:px-2 [&_th]:py-1"
        data-testid="matched-table"
      >
        <caption className="text-left font-bold">Operating point at the reference speeds</caption>
        <thead>
          <tr className="text-left">
            <th scope="col">Speed</th>
            <th scope="col">Engine</th>
            <th scope="col">Shaft power</th>
            <th scope="col">Flow φ</th>
            <th scope="col">Pump η</th>
            <th scope="col">Jet velocity</th>
            <th scope="col">Thrust</th>
            <th scope="col">Fixed power</th>
            <th scope="col">Held by</th>
            {withCavitation && <th scope="col">Inlet (NPSH available / required)</th>}
          </tr>
        </thead>
        <tbody>
          {MATCHED_REFERENCE_SPEEDS_MS.map((speed) => {
            const i = points.findIndex((p) => p.speedMs === speed);
            const p = points[i];
            const speedCell = `${speed} m/s`;
            if (!p) {
              return (
                <tr key={speed} data-testid={`matched-row-${speed}`}>
                  <th scope="row" className="text-left">
                    {speedCell}
                  </th>
                  <td colSpan={withCavitation ? 9 : 8}>No operating point</td>
                </tr>
              );
            }
            const f = fixed[i];
            return (
              <tr key={speed} data-testid={`matched-row-${speed}`} className="figure">
                <th scope="row" className="text-left">
                  {speedCell}
                </th>
                <td>{p.rpm.toFixed(0)} rpm</td>
                <td>{p.shaftPowerKw.toFixed(1)} kW</td>
                <td>{p.flowCoefficient.toFixed(3)}</td>
                <td>{p.pumpEfficiency.toFixed(3)}</td>
                <td>{p.jetVelocityMs.toFixed(1)} m/s</td>
                <td data-testid="thrust">{p.thrustN.toFixed(0)} N</td>
                <td data-testid="fixed-thrust">{f === undefined ? '—' : `${f.toFixed(0)} N`}</td>
                <td>{p.limitedBy === 'limiter' ? 'limiter' : 'engine curve'}</td>
                {withCavitation && (
                  <td data-testid="cavitation">
                    {p.cavitating ? 'cavitating' : 'no'} ({p.availableNpshM?.toFixed(1)} m /{' '}
                    {p.requiredNpshM?.toFixed(1)} m)
                  </td>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
