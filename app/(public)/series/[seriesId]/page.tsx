import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { AppError } from '@/lib/core/errors';
import { SERIES_CAUTION } from '@/lib/core/series/series-caution';
import { parseId } from '@/lib/server/http/ids';
import { getSeries, type SeriesView } from '@/lib/server/series/get-series';
import { loadStandings } from '@/lib/server/series/standings';
import { listBulletins } from '@/lib/server/series/bulletins';
import { StandingsTable } from './standings-table';

export const dynamic = 'force-dynamic';

async function openSeries(raw: string): Promise<SeriesView> {
  try {
    return await getSeries(parseId(raw, 'series'));
  } catch (e) {
    if (e instanceof AppError && e.status === 404) notFound();
    throw e;
  }
}

export async function generateMetadata({ params }: { params: Promise<{ seriesId: string }> }): Promise<Metadata> {
  const s = await openSeries((await params).seriesId);
  return { title: `${s.name} ${s.season}: standings` };
}

// Public page of a series: each class's standings after the rounds held, its rounds, rules versions and bulletins.
export default async function SeriesPage({ params }: { params: Promise<{ seriesId: string }> }) {
  const series = await openSeries((await params).seriesId);
  const classes = await Promise.all(
    series.classes.map(async (c) => ({
      c,
      standings: await loadStandings(series.id, c.id),
      bulletins: await listBulletins(series.id, c.id),
    })),
  );
  return (
    <article className="space-y-8">
      <header className="space-y-2">
        <p className="text-sm font-bold uppercase tracking-widest text-flare-600">Series · season {series.season}</p>
        <h1 data-testid="series-title">{series.name}</h1>
        <p className="text-ink-soft">Run by {series.organisations.map((o) => o.name).join(', ')}</p>
        <aside role="note" className="rounded-lg border-l-4 border-flare-500 bg-flare-100 px-3 py-2 text-sm text-ink">
          {SERIES_CAUTION}
        </aside>
      </header>
      {classes.length === 0 && <p>No classes in this series yet.</p>}
      {classes.map(({ c, standings, bulletins }) => (
        <section key={c.id} className="space-y-4" aria-labelledby={`class-${c.id}`}>
          <h2 id={`class-${c.id}`}>
            {c.name} ({c.code})
          </h2>
          <p className="text-sm text-ink-soft">
            Points by place: {c.pointsByPosition.join(', ')}. Dropped rounds: {c.droppedRounds}. {standings.dropRule}{' '}
            {standings.tieRule}
          </p>
          <StandingsTable standings={standings} />
          <p className="text-sm">
            <a href={`/series/${series.id}/classes/${c.id}/parity`}>
              For the series&apos; officials: parity history, bulletins and exports
            </a>
          </p>
          <h3>Rounds</h3>
          <ol className="list-decimal pl-6 text-sm">
            {standings.rounds.map((r) => (
              <li key={r.classId}>
                {r.eventName}, {r.startsOn}: {r.resultsVersion ? `results version ${r.resultsVersion}` : 'not held yet'}
              </li>
            ))}
          </ol>
          <h3>Rules versions</h3>
          {c.ruleVersions.length === 0 ? (
            <p className="text-sm">None published yet.</p>
          ) : (
            <ul className="text-sm">
              {c.ruleVersions.map((v) => (
                <li key={v.version}>
                  Version {v.version}, in force from {v.effectiveFrom}
                  {v.changeNote ? `: ${v.changeNote}` : ''}
                </li>
              ))}
            </ul>
          )}
          <h3>Technical bulletins</h3>
          {bulletins.length === 0 ? (
            <p className="text-sm">None published.</p>
          ) : (
            bulletins.map((b) => (
              <article key={b.id} className="card text-sm" data-testid="bulletin">
                <h4 className="font-bold">
                  Bulletin {b.number}: {b.title}
                </h4>
                <p className="text-ink-soft">In effect from {b.effectiveFrom}</p>
                <p className="whitespace-pre-wrap">{b.body}</p>
              </article>
            ))
          )}
        </section>
      ))}
    </article>
  );
}
