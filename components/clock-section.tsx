import type { ClockSection as ClockSectionFigures } from '@/lib/core/timing/clock-section';
import type { CatalogueImpeller } from '@/lib/core/timing/balance-levers';
import { figureValue } from '@/lib/core/format/figures';
import { massWords, thrustModelWord } from '@/lib/core/reports/clock-report-lines';
import { ClockScatter } from './clock-scatter';
import { ClockLevers } from './clock-levers';

const s = (v: number | null, digits = 2) => (v === null ? '—' : v.toFixed(digits));
const kmh = (ms: number | null) => (ms === null ? '—' : figureValue(ms * 3.6, 'speedKmh'));
const DRAG_WORDS = {
  trap_speed: 'trap speed',
  gps_top_speed: 'GPS top speed',
  class_default: 'class default',
} as const;

/**
 * A class's predicted runs (each boat on its thrust model) against its run times: tables, the comparison, the chart. The
 * parity report shows it without the levers (`withLevers={false}`): a published version is a record, not a sandbox.
 */
export function ClockSection({
  section,
  withLevers = true,
}: {
  section: ClockSectionFigures & { classCode: string; className: string; pumpCatalogue?: CatalogueImpeller[] };
  withLevers?: boolean;
}) {
  const c = section.comparison;
  const A = section.assumptions;
  return (
    <section aria-labelledby="clock-heading" className="space-y-4" data-testid="clock-section">
      <h2 id="clock-heading">
        {section.classCode} · {section.className}: model against the clock
      </h2>
      <div className="card space-y-2 text-sm">
        <h3>How the prediction is made</h3>
        <ul className="list-disc space-y-1 pl-5">
          <li>
            Thrust T(V): the class&apos;s report model, per boat. Matched (where engine and pump settle) for a boat of a
            class that reports on it whose inspected declaration holds both curves, its engine curve scaled to the power
            the inspection confirmed; else fixed power (momentum theory at constant shaft power). The Thrust column says
            which, and why a boat stayed on fixed power.
          </li>
          <li>
            Each boat starts from rest on a straight line: m·dV/dt = T(V) − k·V², integrated by the classical
            fourth-order Runge–Kutta method with a step-halving check (Butcher, 2016; Press et al., Numerical Recipes,
            2007); the worst relative accuracy reached was{' '}
            {section.worstRelativeAccuracy === null ? '—' : section.worstRelativeAccuracy.toExponential(1)}. Turns,
            starts and driving are not modelled.
          </li>
          <li data-testid="clock-mass-words">
            Mass: the weight measured at inspection (else the class minimum) plus {massWords(section)}.
          </li>
          <li>
            Drag k: fitted so that thrust equals drag at the boat&apos;s own top speed (GPS, else trap); without one,
            the class median of the fitted values; with none in the class, an assumed{' '}
            {(A.assumedTopSpeedMs * 3.6).toFixed(0)} km/h. Each row says which.
          </li>
        </ul>
        <p data-testid="clock-caution">
          A prediction from a model, not a result or a verdict: the governing body&apos;s rules and its officials
          decide.
        </p>
      </div>
      <div className="card overflow-x-auto" tabIndex={0} role="region" aria-label="Predicted runs">
        <table className="w-full text-left text-sm" data-testid="clock-predictions">
          <thead className="bg-paper-deep">
            <tr>
              <th className="p-2">No.</th>
              <th className="p-2">Boat</th>
              <th className="p-2">Mass (kg)</th>
              {A.referenceDistancesM.map((d) => (
                <th key={d} className="p-2">
                  {d} m (s)
                </th>
              ))}
              <th className="p-2">{section.courseLengthM === null ? 'Course' : `${section.courseLengthM} m`} (s)</th>
              <th className="p-2">Top speed (km/h)</th>
              <th className="p-2">Thrust/weight</th>
              <th className="p-2">kW/t</th>
              <th className="p-2">Drag from</th>
              <th className="p-2">Thrust</th>
            </tr>
          </thead>
          <tbody>
            {section.boats.map((b) => (
              <tr key={b.entryId} className="border-t border-paper-line">
                <td className="figure p-2">{b.raceNumber}</td>
                <td className="p-2">
                  {b.boatName}
                  {b.note && <span className="block text-xs">{b.note}</span>}
                </td>
                <td className="figure p-2" title={b.massBasis}>
                  {b.massKg === null ? '—' : figureValue(b.massKg, 'massKg')}
                  <span className="block text-xs text-ink-soft">{b.massBasis}</span>
                </td>
                {b.referenceTimesS.map((t, i) => (
                  <td key={i} className="figure p-2">
                    {s(t)}
                  </td>
                ))}
                <td className="figure p-2">
                  {s(b.courseTimeS)}
                  {b.uTimeS !== null && b.uTimeS > 0 && (
                    <span className="block text-xs text-ink-soft">± {(2 * b.uTimeS).toFixed(2)} (U, k = 2)</span>
                  )}
                </td>
                <td className="figure p-2">{kmh(b.topSpeedMs)}</td>
                <td className="figure p-2">{s(b.thrustToWeight)}</td>
                <td className="figure p-2">{s(b.powerToWeightKwPerT, 0)}</td>
                <td className="p-2 text-xs">
                  {b.dragBasis ? DRAG_WORDS[b.dragBasis] : '—'}
                  <span className="block text-ink-soft">{b.dragNote}</span>
                </td>
                <td className="p-2 text-xs" data-testid="clock-thrust-model">
                  {thrustModelWord(b)}
                  {b.thrustModelReason && <span className="block text-ink-soft">{b.thrustModelReason}</span>}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {withLevers && <ClockLevers section={section} catalogue={section.pumpCatalogue} />}
      <div className="card space-y-3">
        <h3>Predicted against observed{section.courseLengthM !== null && ` over ${section.courseLengthM} m`}</h3>
        {section.otherCourseRuns > 0 && (
          <p className="text-sm">
            {section.otherCourseRuns} run{section.otherCourseRuns === 1 ? '' : 's'} over other course lengths left out.
          </p>
        )}
        {c.notes.length > 0 && (
          <ul className="list-disc space-y-1 pl-5" data-testid="clock-notes">
            {c.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        )}
        <dl className="grid grid-cols-[1fr_auto] gap-x-4 gap-y-1 text-sm sm:max-w-xl" data-testid="clock-figures">
          <dt>Boats compared</dt>
          <dd className="figure">{c.points.length}</dd>
          <dt>Pearson r</dt>
          <dd className="figure">{s(c.pearson)}</dd>
          <dt>Spearman ρ (rank)</dt>
          <dd className="figure">{s(c.spearman)}</dd>
          <dt>|r| needed to mean anything (5 %)</dt>
          <dd className="figure">{s(c.criticalR)}</dd>
          <dt>Mean residual, observed − predicted (s)</dt>
          <dd className="figure">{s(c.meanResidualS)}</dd>
          <dt>Residual scatter, SD (s)</dt>
          <dd className="figure">{s(c.residualSpreadS)}</dd>
          <dt>Run-to-run spread, pooled SD (s)</dt>
          <dd className="figure">{s(c.pooledRunSpreadS)}</dd>
          <dt>
            Smallest difference the clock tells apart
            {c.runsPerBoatForDifference !== null && ` (${c.runsPerBoatForDifference} runs each, 95 %)`} (s)
          </dt>
          <dd className="figure">{s(c.smallestDifferenceS)}</dd>
        </dl>
        {c.points.length > 0 && (
          <ClockScatter
            points={c.points.map((p) => ({
              label: `#${p.raceNumber} ${p.boatName}`,
              predicted: p.predictedS,
              observed: p.meanObservedS,
            }))}
          />
        )}
        {c.points.length > 0 && (
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Each boat against the clock">
            <table className="w-full text-left text-sm" data-testid="clock-points">
              <thead className="bg-paper-deep">
                <tr>
                  <th className="p-2">No.</th>
                  <th className="p-2">Boat</th>
                  <th className="p-2">Predicted (s)</th>
                  <th className="p-2">Observed mean (s)</th>
                  <th className="p-2">Runs</th>
                  <th className="p-2">Run-to-run SD (s)</th>
                  <th className="p-2">Residual (s)</th>
                </tr>
              </thead>
              <tbody>
                {c.points.map((p) => (
                  <tr key={p.entryId} className="border-t border-paper-line">
                    <td className="figure p-2">{p.raceNumber}</td>
                    <td className="p-2">{p.boatName}</td>
                    <td className="figure p-2">{s(p.predictedS)}</td>
                    <td className="figure p-2">{s(p.meanObservedS)}</td>
                    <td className="figure p-2">{p.runs}</td>
                    <td className="figure p-2">{s(p.runSpreadS)}</td>
                    <td className="figure p-2">{s(p.residualS)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
        {c.leftOut.length > 0 && (
          <p className="text-sm">
            Left out: {c.leftOut.map((l) => `#${l.raceNumber} ${l.boatName} (${l.reason.toLowerCase()})`).join('; ')}.
          </p>
        )}
      </div>
    </section>
  );
}
