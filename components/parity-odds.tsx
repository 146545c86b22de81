import type { ReportInputs, ReportResults } from '@/lib/core/reports/parity-figures';
import { POWER_EVIDENCE_LABELS, POWER_EVIDENCE_SHARE } from '@/lib/core/reports/power-uncertainty';
import { convertForce, convertSpeed, type ForceUnit, type SpeedUnit } from '@/lib/core/engine/units';

const f = (x: number | null | undefined, d = 1) =>
  x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toFixed(d);
const pct = (p: number) => `${Math.round(p * 100)} %`;

/** A probability as a cell: the colour says which way it leans, the text says how much. */
function oddsClass(p: number): string {
  if (p >= 0.95) return 'bg-pass-100 font-bold';
  if (p <= 0.05) return 'bg-flare-100';
  return '';
}

/**
 * What the uncertainties mean for the class: where each boat's power uncertainty comes from, the
 * nozzle that equalises over the speed range beside the static one, how sure the report is that one
 * boat out-thrusts another, and how much of the spread is noise (Monte Carlo, JCGM 101:2008).
 */
export function ParityOdds({
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
  const p = results.parity;
  if (!p) return null;
  const N = (x: number | null | undefined) =>
    x === null || x === undefined || !Number.isFinite(x) ? null : convertForce(x, 'N', forceUnit);
  const V = (x: number) => convertSpeed(x, 'm/s', speedUnit);
  const byId = new Map(inputs.boats.map((b) => [b.entryId, b]));
  const label = (id: string) => {
    const b = byId.get(id);
    return b ? `#${b.raceNumber}` : id;
  };
  const odds = results.odds;
  const speedAt = (i: number) => (odds ? odds.speedsMs[i] : 0);
  return (
    <div className="space-y-6">
      <section aria-labelledby="power-evidence" className="card overflow-x-auto" tabIndex={0}>
        <h2 id="power-evidence" className="text-xl">
          Uncertainty of static thrust: power and nozzle
        </h2>
        <p className="mt-1 text-sm text-ink-mute">
          The power&apos;s uncertainty follows the evidence seen at inspection (expanded, k = 2: sealed dyno sheet{' '}
          {pct(POWER_EVIDENCE_SHARE.dyno_sheet)}, maker&apos;s rating {pct(POWER_EVIDENCE_SHARE.maker_rating)},
          declaration only {pct(POWER_EVIDENCE_SHARE.declaration_only)} of the power, never below the class&apos;s own
          figure; common practice, no published source). Standard uncertainties (k = 1) below, first order (JCGM
          100:2008, 5.1.2).
        </p>
        <table
          className="mt-3 w-full min-w-[32rem] whitespace-nowrap text-left text-sm [&_td]:pr-3 [&_th]:pr-3"
          data-testid="power-evidence-table"
        >
          <thead className="bg-paper-deep">
            <tr className="text-left">
              <th scope="col">Boat</th>
              <th scope="col">Power evidence</th>
              <th scope="col">u(power)</th>
              <th scope="col">u(T₀) from power</th>
              <th scope="col">u(T₀) from nozzle</th>
            </tr>
          </thead>
          <tbody>
            {p.boats.map((b) => {
              const input = byId.get(b.id);
              return (
                <tr key={b.id} className="border-t border-paper-line">
                  <th scope="row" className="text-left font-normal">
                    {b.label}
                  </th>
                  <td>{input?.powerEvidence ? POWER_EVIDENCE_LABELS[input.powerEvidence] : '—'}</td>
                  <td className="figure">{f(input?.uPowerKw, 1)} kW</td>
                  <td className="figure">
                    {f(N(b.uStaticThrustFromPowerN), 0)} {forceUnit}
                  </td>
                  <td className="figure">
                    {f(N(b.uStaticThrustFromDiameterN), 0)} {forceUnit}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </section>

      {p.boats.some((b) => b.rangeEqualising) && (
        <section aria-labelledby="range-nozzle" className="card overflow-x-auto" tabIndex={0}>
          <h2 id="range-nozzle" className="text-xl">
            Equalising nozzle: at rest and over the speed range
          </h2>
          <p className="mt-1 text-sm text-ink-mute">
            The static nozzle gives each boat the class median thrust at rest only. The range nozzle makes the sum of
            squared relative deviations from the class median thrust at the reference speeds as small as it can be
            (least squares). Deviations in per cent of the class median at each speed.
          </p>
          <table
            className="mt-3 w-full min-w-[40rem] whitespace-nowrap text-left text-sm [&_td]:pr-3 [&_th]:pr-3"
            data-testid="range-nozzle-table"
          >
            <thead className="bg-paper-deep">
              <tr className="text-left">
                <th scope="col">Boat</th>
                <th scope="col">Static nozzle</th>
                <th scope="col">Range nozzle</th>
                {p.boats[0].rangeEqualising?.deviations.map((d) => (
                  <th key={d.speedMs} scope="col">
                    at {f(V(d.speedMs), 0)} {speedUnit}: static / range
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {p.boats.map((b) => (
                <tr key={b.id} className="border-t border-paper-line">
                  <th scope="row" className="text-left font-normal">
                    {b.label}
                  </th>
                  <td className="figure">{f(b.equalisingNozzleDiameterMm, 2)} mm</td>
                  <td className="figure">{f(b.rangeEqualising?.nozzleDiameterMm, 2)} mm</td>
                  {b.rangeEqualising?.deviations.map((d) => (
                    <td key={d.speedMs} className="figure">
                      {f(d.staticEqualisedPercent, 1)} % / {f(d.rangeEqualisedPercent, 1)} %
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      )}

      {odds && (
        <section aria-labelledby="odds" className="card overflow-x-auto" tabIndex={0}>
          <h2 id="odds" className="text-xl">
            Who really out-thrusts whom
          </h2>
          <p className="mt-1 text-sm text-ink-mute">
            Monte Carlo over every boat&apos;s power and nozzle uncertainties (JCGM 101:2008;{' '}
            {odds.trials.toLocaleString('en')} trials, fixed seed {odds.seed}, so the figures reproduce). Each cell: the
            chance that the boat of the row has more static thrust than the boat of the column. Near 50 % the data
            cannot tell the two apart.
          </p>
          <dl className="mt-3 grid grid-cols-1 gap-2 sm:grid-cols-3" data-testid="spread-odds">
            <div>
              <dt className="text-sm text-ink-mute">Spread of the figures as measured</dt>
              <dd className="figure text-lg">{f(odds.spread.nominalPercent, 2)} %</dd>
            </div>
            <div>
              <dt className="text-sm text-ink-mute">Spread that noise alone adds up to (mean)</dt>
              <dd className="figure text-lg">{f(odds.spread.mean, 2)} %</dd>
            </div>
            <div>
              <dt className="text-sm text-ink-mute">95 % coverage interval of the spread</dt>
              <dd className="figure text-lg">
                {f(odds.spread.low95, 2)} – {f(odds.spread.high95, 2)} %
              </dd>
            </div>
          </dl>
          <p className="mt-2 text-sm">
            A max/min spread is biased upwards by noise, more so in a small class: compare the measured spread with the
            interval above before reading it as a real difference.
          </p>
          {p.boats.length <= 24 ? (
            <table className="mt-3 whitespace-nowrap text-sm" data-testid="odds-matrix">
              <caption className="text-left text-sm text-ink-mute">
                At rest ({f(V(speedAt(0)), 0)} {speedUnit})
              </caption>
              <thead className="bg-paper-deep">
                <tr>
                  <th scope="col">Row ahead of column</th>
                  {p.boats.map((b) => (
                    <th key={b.id} scope="col" className="px-1">
                      {label(b.id)}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {p.boats.map((row) => (
                  <tr key={row.id} className="border-t border-paper-line">
                    <th scope="row" className="pr-2 text-left font-normal">
                      {label(row.id)}
                    </th>
                    {p.boats.map((col) => {
                      if (col.id === row.id)
                        return (
                          <td key={col.id} className="px-1 text-center text-ink-mute">
                            —
                          </td>
                        );
                      const pair = odds.pairs.find(
                        (x) => (x.aId === row.id && x.bId === col.id) || (x.aId === col.id && x.bId === row.id),
                      );
                      const raw = pair?.probabilityAAhead[0]?.probability ?? NaN;
                      const prob = pair && pair.aId === row.id ? raw : 1 - raw;
                      return (
                        <td key={col.id} className={`figure px-1 text-center ${oddsClass(prob)}`}>
                          {Number.isFinite(prob) ? pct(prob) : '—'}
                        </td>
                      );
                    })}
                  </tr>
                ))}
              </tbody>
            </table>
          ) : (
            <p className="mt-3 text-sm">
              The class is too large for a table of every pair; the figures are in the JSON export.
            </p>
          )}
        </section>
      )}
    </div>
  );
}
