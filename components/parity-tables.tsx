import type { ReportInputs, ReportResults } from '@/lib/core/reports/parity-figures';
import { convertForce, convertSpeed, type ForceUnit, type SpeedUnit } from '@/lib/core/engine/units';
import { ModelCell, ReportModelNotes, UpperBoundMark, isCavitatingAt } from './parity-model-notes';

const f = (x: number | null | undefined, d = 1) =>
  x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toFixed(d);
// Decimals that keep each unit's figure at about the same resolution as the SI one (N to 1 N, speeds to 0.1).
const FORCE_DIGITS: Record<ForceUnit, number> = { N: 0, kgf: 1, lbf: 0 };
const SPEED_DIGITS: Record<SpeedUnit, number> = { 'm/s': 2, 'km/h': 1, kn: 1, mph: 1 };

/** Class figures, the per-boat table and the boats left out, in the units chosen for the charts. */
export function ParityTables({
  inputs,
  results,
  forceUnit = 'N',
  speedUnit = 'm/s',
}: {
  inputs: ReportInputs;
  results: ReportResults;
  forceUnit?: ForceUnit;
  speedUnit?: SpeedUnit;
}) {
  const N = (x: number | null | undefined) =>
    x === null || x === undefined || !Number.isFinite(x) ? null : convertForce(x, 'N', forceUnit);
  const V = (x: number | null | undefined) =>
    x === null || x === undefined || !Number.isFinite(x) ? null : convertSpeed(x, 'm/s', speedUnit);
  const fd = FORCE_DIGITS[forceUnit];
  const sd = SPEED_DIGITS[speedUnit];
  const p = results.parity;
  const c = results.classFigures;
  const byId = new Map(inputs.boats.map((b) => [b.entryId, b]));
  return (
    <div className="space-y-6">
      {p && c && (
        <section aria-labelledby="class-figures" className="card">
          <h2 id="class-figures" className="text-xl">
            Class figures
          </h2>
          <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-2 sm:grid-cols-4" data-testid="class-figures">
            <div>
              <dt className="text-sm text-ink-mute">Boats</dt>
              <dd className="figure text-lg">{p.summary.boatCount}</dd>
            </div>
            <div>
              <dt className="text-sm text-ink-mute">Median static thrust</dt>
              <dd className="figure text-lg">
                {f(N(c.medianStaticThrustN.value), fd)} ± {f(N(c.medianStaticThrustN.u), fd)} {forceUnit}
              </dd>
            </div>
            <div>
              <dt className="text-sm text-ink-mute">Min / max</dt>
              <dd className="figure text-lg">
                {f(N(c.minStaticThrustN.value), fd)} / {f(N(c.maxStaticThrustN.value), fd)} {forceUnit}
              </dd>
            </div>
            <div>
              <dt className="text-sm text-ink-mute">Max/min ratio</dt>
              <dd className="figure text-lg">{f(p.summary.maxMinRatio, 4)}</dd>
            </div>
            <div>
              <dt className="text-sm text-ink-mute">Spread</dt>
              <dd className="figure text-lg" data-testid="spread-percent">
                {f(c.spreadPercent.value, 2)} ± {f(c.spreadPercent.u, 2)} %
              </dd>
            </div>
            <div>
              <dt className="text-sm text-ink-mute">Coefficient of variation</dt>
              <dd className="figure text-lg">
                {p.summary.coefficientOfVariationPercent === null
                  ? '—'
                  : `${f(p.summary.coefficientOfVariationPercent, 2)} %`}
              </dd>
            </div>
            <div>
              <dt className="text-sm text-ink-mute">Static jet velocity</dt>
              <dd className="figure text-lg">
                {f(V(c.jetVelocityMinMs), sd)}–{f(V(c.jetVelocityMaxMs), sd)} {speedUnit}
              </dd>
            </div>
            <div>
              <dt className="text-sm text-ink-mute">Jet velocity spread</dt>
              <dd className="figure text-lg">{f(c.jetVelocitySpreadPercent, 2)} %</dd>
            </div>
          </dl>
          <p className="mt-3 text-sm text-ink-mute">
            ± values are standard uncertainties (k = 1) carried from each boat&apos;s measured nozzle and power (JCGM
            100:2008).
          </p>
        </section>
      )}
      {p && (
        <section aria-labelledby="per-boat" className="card overflow-x-auto p-0" tabIndex={0}>
          <h2 id="per-boat" className="p-4 text-xl">
            Per boat
          </h2>
          <table className="w-full min-w-[52rem] text-left text-sm" data-testid="per-boat-table">
            <thead className="bg-paper-deep">
              <tr>
                <th className="p-2">No.</th>
                <th className="p-2">Boat</th>
                <th className="p-2">Model</th>
                <th className="p-2">Power kW</th>
                <th className="p-2">Nozzle mm</th>
                <th className="p-2" data-testid="static-thrust-heading">
                  Static thrust {forceUnit}
                </th>
                <th className="p-2">Jet {speedUnit}</th>
                <th className="p-2">vs median</th>
                {inputs.assumptions.referenceSpeedsMs.map((v) => (
                  <th key={v} className="p-2">
                    {forceUnit} at {Number(V(v)!.toFixed(1))} {speedUnit}
                  </th>
                ))}
                <th className="p-2">Crosses median at</th>
                <th className="p-2">Equalising nozzle</th>
              </tr>
            </thead>
            <tbody>
              {p.boats.map((b) => {
                const i = byId.get(b.id)!;
                return (
                  <tr
                    key={b.id}
                    className={`border-t border-paper-line ${b.isReferenceBoat ? 'bg-flare-100' : ''}`}
                    data-entry={b.id}
                  >
                    <td className="figure p-2 font-bold">{i.raceNumber}</td>
                    <td className="p-2">
                      {i.boatName}
                      {b.isReferenceBoat && <span className="ml-1 text-xs font-bold">(median)</span>}
                      {i.awaitingReinspection && (
                        <span className="ml-1 text-xs font-bold text-flare-600" data-testid="awaiting-reinspection">
                          (re-inspection required)
                        </span>
                      )}
                    </td>
                    <ModelCell results={results} entryId={b.id} />
                    <td className="figure p-2">
                      {f(b.powerKw, 0)} <span className="text-ink-mute">{i.powerSource === 'verified' ? '✓' : ''}</span>
                    </td>
                    <td className="figure p-2">
                      {f(b.nozzleDiameterMm, 2)} ± {f(i.uNozzleDiameterMm, 3)}
                    </td>
                    <td className="figure p-2" data-col="static-thrust">
                      <UpperBoundMark flagged={isCavitatingAt(results, b.id, 0)} />
                      {f(N(b.staticThrustN), fd)} ± {f(N(b.uStaticThrustN), fd)}
                    </td>
                    <td className="figure p-2">{f(V(b.staticJetVelocityMs), sd)}</td>
                    <td
                      className={`figure p-2 font-bold ${b.deviationFromMedianPercent >= 0 ? 'text-tide-700' : 'text-flare-600'}`}
                    >
                      {b.deviationFromMedianPercent >= 0 ? '+' : ''}
                      {f(b.deviationFromMedianPercent, 2)} %
                    </td>
                    {b.thrustAtReferenceSpeeds.map((t) => (
                      <td key={t.speedMs} className="figure p-2">
                        <UpperBoundMark flagged={isCavitatingAt(results, b.id, t.speedMs)} />
                        {f(N(t.thrustN), fd)}
                      </td>
                    ))}
                    <td className="figure p-2">
                      {b.crossoverWithMedianMs === null ? '—' : `${f(V(b.crossoverWithMedianMs), 1)} ${speedUnit}`}
                    </td>
                    <td className="figure p-2">{f(b.equalisingNozzleDiameterMm, 2)} mm</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </section>
      )}
      {p && <ReportModelNotes inputs={inputs} results={results} />}
      {inputs.boats.some((b) => b.awaitingReinspection) && (
        <section aria-labelledby="awaiting" className="card">
          <h2 id="awaiting" className="text-xl">
            Declarations changed since inspection
          </h2>
          <p className="mt-1 text-sm">
            These boats&apos; figures are those confirmed at their inspection, not what the owner declared since; each
            must be inspected again.
          </p>
          <ul className="mt-2 space-y-1" data-testid="awaiting-reinspection-list">
            {inputs.boats
              .filter((b) => b.awaitingReinspection)
              .map((b) => (
                <li key={b.entryId}>
                  #{b.raceNumber} {b.boatName}: {b.awaitingReinspection}
                </li>
              ))}
          </ul>
        </section>
      )}
      {inputs.excluded.length > 0 && (
        <section aria-labelledby="excluded" className="card">
          <h2 id="excluded" className="text-xl">
            Boats not in the figures ({inputs.excluded.length})
          </h2>
          <ul className="mt-2 space-y-1" data-testid="excluded-boats">
            {inputs.excluded.map((e) => (
              <li key={e.entryId}>
                #{e.raceNumber} {e.boatName}: {e.reason}
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}

export function ModelAssumptions({ inputs }: { inputs: ReportInputs }) {
  const a = inputs.assumptions;
  return (
    <section aria-labelledby="model" className="card text-sm">
      <h2 id="model" className="text-xl">
        How these figures are made
      </h2>
      <p className="mt-2">
        Momentum theory of a water jet at fixed shaft power (Allison, SNAME Transactions 101, 1993; Faltinsen, 2005,
        §2.11; MIT 2.611 course notes): pump efficiency {a.pumpEfficiency}, nozzle loss coefficient{' '}
        {a.nozzleLossCoefficient}, inlet loss coefficient {a.inletLossCoefficient}, wake fraction {a.wakeFraction}.
        Water: {inputs.density.description} ({inputs.density.densityKgM3.toFixed(4)} kg/m³). Each boat&apos;s nozzle is
        the area-equivalent diameter of its latest conforming inspection&apos;s two-point readings at 20 °C; power is
        the declared figure (✓ where the scrutineer saw the evidence). Class rules version {inputs.ruleVersion.version}.
        {a.reportModel === 'matched' &&
          ' This class chose the matched model: a boat with both curves declared is figured where its engine and pump settle instead (see “Model per boat”).'}
      </p>
    </section>
  );
}
