import type { ClockSection } from '@/lib/core/timing/clock-section';
import { suggestEqualisation } from '@/lib/core/timing/equalisation';

const s = (v: number | null, digits = 2) => (v === null ? '—' : v.toFixed(digits));
const signed = (v: number) => `${v >= 0 ? '+' : ''}${v.toFixed(2)}`;

/**
 * Per boat: its predicted time against the class median in seconds, and the ballast or nozzle restrictor that would
 * bring a faster boat to the median, each with its expanded uncertainty. Computed on the server (lib/core/timing/
 * equalisation.ts): a suggestion for the rules committee, not a ruling.
 */
export function ClockEqualisation({ section }: { section: ClockSection }) {
  const eq = suggestEqualisation(section);
  return (
    <section className="card space-y-3" aria-labelledby="equalisation-heading" data-testid="clock-equalisation">
      <h3 id="equalisation-heading">Equalisation suggestion per boat ({eq.distanceM} m)</h3>
      {eq.medianS === null ? (
        <p>At least two boats need a predicted time before a median can be suggested to.</p>
      ) : (
        <>
          <p className="text-sm">
            {`Class median predicted time ${eq.medianS.toFixed(2)} s.`} For a boat faster than the median: the ballast,
            or instead the nozzle restrictor, that brings its predicted time to the median, the same model as the levers
            (fixed-power thrust, the boat&apos;s own drag). U is expanded (k = 2) from the boat&apos;s power, nozzle and
            weighing uncertainties, the median taken as exact (JCGM 100:2008, first order). A suggestion for the rules
            committee: the governing body&apos;s rules and its officials decide.
          </p>
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Equalisation per boat">
            <table className="w-full text-left text-sm">
              <thead className="bg-paper-deep">
                <tr>
                  <th className="p-2">No.</th>
                  <th className="p-2">Boat</th>
                  <th className="p-2">From median (s)</th>
                  <th className="p-2">Ballast (kg)</th>
                  <th className="p-2">or nozzle (mm)</th>
                </tr>
              </thead>
              <tbody>
                {eq.boats.map((b) => (
                  <tr key={b.entryId} className="border-t border-paper-line">
                    <td className="figure p-2">{b.raceNumber}</td>
                    <td className="p-2">
                      {b.boatName}
                      {b.note && <span className="block text-xs text-ink-soft">{b.note}</span>}
                    </td>
                    <td className="figure p-2">
                      {signed(b.fromMedianS)}
                      {b.uFromMedianS !== null && ` ± ${b.uFromMedianS.toFixed(2)}`}
                    </td>
                    <td className="figure p-2">
                      {s(b.ballastKg, 1)}
                      {b.ballastKg !== null && b.uBallastKg !== null && ` ± ${b.uBallastKg.toFixed(1)}`}
                    </td>
                    <td className="figure p-2">
                      {s(b.nozzleMm, 2)}
                      {b.nozzleMm !== null && b.uNozzleMm !== null && ` ± ${b.uNozzleMm.toFixed(2)}`}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
    </section>
  );
}
