'use client';

import { useMemo } from 'react';
import dynamic from 'next/dynamic';
import { WhenVisible } from './when-visible';
import { convertForce, convertSpeed, type ForceUnit, type SpeedUnit } from '@/lib/core/engine/units';
import type { ReportInputs, ReportResults } from '@/lib/core/reports/parity-figures';

// recharts arrives when a chart is drawn, not with the page, and a chart is drawn when it comes near the
// screen (each chart's box is sized here, so nothing moves).
const drawings = () => import('./parity-chart-drawings');
const ThrustCurvesDrawing = dynamic(() => drawings().then((m) => m.ThrustCurvesDrawing), { ssr: false });
const DeviationDrawing = dynamic(() => drawings().then((m) => m.DeviationDrawing), { ssr: false });
const JetVelocityDrawing = dynamic(() => drawings().then((m) => m.JetVelocityDrawing), { ssr: false });
const BOAT_COLOURS = ['#1f5f8b', '#2a3a48', '#51606d', '#103a57', '#3d7aa8', '#5b6b78'];
// Colour and dash together tell 24 boats apart; the legend below the chart names each line.
const BOAT_DASHES = ['', '6 3', '2 3', '10 3 2 3'];
const boatStyle = (i: number) => ({
  stroke: BOAT_COLOURS[i % BOAT_COLOURS.length],
  dash: BOAT_DASHES[Math.floor(i / BOAT_COLOURS.length) % BOAT_DASHES.length],
});

function LineSample({ stroke, dash, width }: { stroke: string; dash: string; width: number }) {
  return (
    <svg width="32" height="10" aria-hidden="true" className="shrink-0">
      <line x1="1" y1="5" x2="31" y2="5" stroke={stroke} strokeWidth={width} strokeDasharray={dash || undefined} />
    </svg>
  );
}

/** The report's charts: thrust curves, static thrust deviation with whiskers, jet velocity spread, in the units chosen above them. */
export function ParityCharts({
  inputs,
  results,
  forceUnit,
  speedUnit,
}: {
  inputs: ReportInputs;
  results: ReportResults;
  forceUnit: ForceUnit;
  speedUnit: SpeedUnit;
}) {
  const f = (n: number) => convertForce(n, 'N', forceUnit);
  const s = (ms: number) => convertSpeed(ms, 'm/s', speedUnit);
  const parity = results.parity;
  const curves = results.curves;

  const lineData = useMemo(() => {
    if (!curves) return [];
    return curves.speedsMs.map((v, i) => {
      const row: Record<string, number> = { speed: +s(v).toFixed(2), median: +f(curves.reference[i]).toFixed(1) };
      for (const [id, ys] of Object.entries(curves.byEntry)) row[id] = +f(ys[i]).toFixed(1);
      return row;
    });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [curves, forceUnit, speedUnit]);

  if (!parity || !curves) return <p>No boat has a conforming inspection yet: there is nothing to chart.</p>;
  const labels = new Map(inputs.boats.map((b) => [b.entryId, `#${b.raceNumber} ${b.boatName}`]));
  const crossovers = parity.boats.filter(
    (b) => b.crossoverWithMedianMs !== null && b.crossoverWithMedianMs <= curves.speedsMs[curves.speedsMs.length - 1],
  );
  const refAt = (ms: number) => {
    const i = Math.min(curves.speedsMs.length - 1, Math.round(ms));
    return f(curves.reference[i]);
  };
  const devData = parity.boats.map((b) => ({
    name: labels.get(b.id) ?? b.label,
    dev: +b.deviationFromMedianPercent.toFixed(2),
    err: +(2 * b.uDeviationFromMedianPercent).toFixed(2),
  }));
  const jetData = parity.boats.map((b) => ({
    name: labels.get(b.id) ?? b.label,
    vj: +s(b.staticJetVelocityMs).toFixed(2),
    err: +(2 * s(b.uStaticJetVelocityMs)).toFixed(2),
  }));

  const drawnBoats = inputs.boats.map((b, i) => ({
    entryId: b.entryId,
    label: labels.get(b.entryId) ?? b.entryId,
    ...boatStyle(i),
  }));
  // Matched points where the pump cavitates: ringed on the chart and listed below it.
  const cavitating = Object.entries(results.modelUsed ?? {}).flatMap(([id, m]) =>
    (m.points ?? []).filter((p) => p.cavitating).map((p) => ({ id, speedMs: p.speedMs, thrustN: p.thrustN })),
  );
  const cavitationDots = cavitating.map((c) => ({
    key: `${c.id}-${c.speedMs}`,
    x: +s(c.speedMs).toFixed(2),
    y: +f(c.thrustN).toFixed(1),
  }));
  const crossoverDots = crossovers.map((b) => ({
    key: b.id,
    x: +s(b.crossoverWithMedianMs!).toFixed(2),
    y: +refAt(b.crossoverWithMedianMs!).toFixed(1),
  }));

  return (
    <div className="space-y-6">
      <figure className="card" data-testid="chart-thrust-curves">
        <figcaption className="mb-2 font-bold">
          Thrust against boat speed ({forceUnit} vs {speedUnit}); the median boat in orange, crossovers marked
        </figcaption>
        <WhenVisible className="h-72 sm:h-96">
          <ThrustCurvesDrawing
            lineData={lineData}
            boats={drawnBoats}
            crossovers={crossoverDots}
            cavitation={cavitationDots}
            forceUnit={forceUnit}
            speedUnit={speedUnit}
            labels={labels}
          />
        </WhenVisible>
        <ul
          className="mt-3 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-2 lg:grid-cols-3"
          aria-label="Lines on the chart"
          data-testid="thrust-legend"
        >
          <li className="flex items-center gap-2 font-bold">
            <LineSample stroke="#e86a10" dash="" width={3} />
            Median boat
          </li>
          {inputs.boats.map((b, i) => (
            <li key={b.entryId} className="flex items-center gap-2">
              <LineSample stroke={boatStyle(i).stroke} dash={boatStyle(i).dash} width={1.5} />
              {labels.get(b.entryId)}
            </li>
          ))}
        </ul>
        {cavitating.length > 0 && (
          <p className="mt-2 text-sm font-bold text-flare-600" data-testid="chart-cavitation">
            Red rings: the pump cavitates there, so the thrust is an upper bound (
            {cavitating
              .map(
                (c) => `${labels.get(c.id)} at ${c.speedMs === 0 ? 'rest' : `${s(c.speedMs).toFixed(1)} ${speedUnit}`}`,
              )
              .join('; ')}
            ).
          </p>
        )}
        {crossovers.length > 0 && (
          <ul className="mt-2 text-sm">
            {crossovers.slice(0, 12).map((b) => (
              <li key={b.id}>
                {labels.get(b.id)} crosses the median boat at {s(b.crossoverWithMedianMs!).toFixed(1)} {speedUnit}
              </li>
            ))}
          </ul>
        )}
      </figure>

      {devData.length < 2 ? (
        <section className="card" data-testid="deviation-single">
          <h2 className="text-lg font-bold">Static thrust deviation from the class median</h2>
          <p className="mt-1">
            Only one boat is in the figures, so it is the median itself: there is no deviation to chart until a second
            boat has a conforming inspection.
          </p>
        </section>
      ) : (
        <figure className="card" data-testid="chart-deviation">
          <figcaption className="mb-2 font-bold">
            Static thrust deviation from the class median (%), whiskers ±2u (about 95 %)
          </figcaption>
          <WhenVisible style={{ height: Math.max(180, devData.length * 26) }}>
            <DeviationDrawing data={devData} />
          </WhenVisible>
        </figure>
      )}

      <figure className="card" data-testid="chart-jet-velocity">
        <figcaption className="mb-2 font-bold">Static jet velocity per boat ({speedUnit}), whiskers ±2u</figcaption>
        <WhenVisible style={{ height: Math.max(180, jetData.length * 26) }}>
          <JetVelocityDrawing data={jetData} speedUnit={speedUnit} />
        </WhenVisible>
      </figure>
    </div>
  );
}
