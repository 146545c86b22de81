import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { AppError } from '@/lib/core/errors';
import { SERIES_CAUTION } from '@/lib/core/series/series-caution';
import { can, getActor } from '@/lib/server/auth/actor';
import { parseId } from '@/lib/server/http/ids';
import { loadParityHistory, type ParityHistoryView } from '@/lib/server/series/parity-history';
import { ParityHistoryChart } from './parity-history-chart';
import { BulletinForm } from './bulletin-form';

export const metadata: Metadata = { title: 'Parity history' };
export const dynamic = 'force-dynamic';

const pct = (x: number | null) => (x === null ? '–' : `${x.toFixed(1)} %`);

// For the series' officials: each round's parity figures side by side, each boat's deviation round by round,
// and the rule changes between rounds, so a committee sees whether a change narrowed the field.
export default async function ParityHistoryPage({
  params,
}: {
  params: Promise<{ seriesId: string; seriesClassId: string }>;
}) {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const p = await params;
  let h: ParityHistoryView;
  try {
    h = await loadParityHistory(actor, parseId(p.seriesId, 'series'), parseId(p.seriesClassId, 'series class'));
  } catch (e) {
    if (e instanceof AppError && e.status === 404) notFound();
    if (e instanceof AppError && e.status === 403)
      return <p className="card">Only the series&apos; secretary and stewards see its parity history.</p>;
    throw e;
  }
  return (
    <article className="space-y-6">
      <header className="space-y-2">
        <h1>
          Parity history: {h.seriesClass.name} ({h.seriesClass.code})
        </h1>
        <aside role="note" className="rounded-lg border-l-4 border-flare-500 bg-flare-100 px-3 py-2 text-sm text-ink">
          {SERIES_CAUTION}
        </aside>
        <p className="text-sm text-ink-soft">
          Each round&apos;s latest published parity report. Spread = (max − min) / median of the static thrusts;
          coefficient of variation = sample standard deviation / mean; a boat&apos;s deviation = (its static thrust −
          median) / median.
        </p>
      </header>
      {h.rounds.length === 0 ? (
        <p className="card">No round has a published parity report yet.</p>
      ) : (
        <>
          <ParityHistoryChart history={h} />
          <div className="overflow-x-auto">
            <table className="w-full text-sm" data-testid="parity-history">
              <caption className="text-left text-ink-soft">
                Figures by round (rule changes marked between rounds)
              </caption>
              <thead>
                <tr>
                  <th scope="col">Boat</th>
                  {h.rounds.map((r, i) => (
                    <th scope="col" key={r.roundId}>
                      R{i + 1} {r.label} ({r.date})
                      {h.ruleChanges
                        .filter((c) => c.afterRoundIndex === i - 1)
                        .map((c) => (
                          <span key={c.version} className="block text-flare-600">
                            rules v{c.version} from {c.effectiveFrom}
                          </span>
                        ))}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                <tr>
                  <th scope="row" className="text-left">
                    Spread
                  </th>
                  {h.rounds.map((r) => (
                    <td key={r.roundId}>{pct(r.spreadPercent)}</td>
                  ))}
                </tr>
                <tr>
                  <th scope="row" className="text-left">
                    Coefficient of variation
                  </th>
                  {h.rounds.map((r) => (
                    <td key={r.roundId}>{pct(r.coefficientOfVariationPercent)}</td>
                  ))}
                </tr>
                {h.competitors.map((c) => (
                  <tr key={c.competitorId}>
                    <th scope="row" className="text-left font-normal">
                      {c.label}
                    </th>
                    {h.rounds.map((r) => (
                      <td key={r.roundId}>{pct(r.deviationsPercent[c.competitorId] ?? null)}</td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
      {can(actor, 'series.bulletin_publish', { seriesId: h.seriesId }) && (
        <BulletinForm seriesId={h.seriesId} seriesClassId={h.seriesClass.id} />
      )}
      <p className="text-sm">
        <a href={`/series/${h.seriesId}`}>Standings, rounds and bulletins</a>
      </p>
      <p className="text-sm">
        Exports for the governing body:{' '}
        {(['standings', 'penalties', 'appeals'] as const).map((k) => (
          <span key={k} className="mr-3">
            {k} <a href={`/api/series/${p.seriesId}/exports/${k}.csv`}>CSV</a> ·{' '}
            <a href={`/api/series/${p.seriesId}/exports/${k}.pdf`}>PDF</a>
          </span>
        ))}
      </p>
    </article>
  );
}
