import type { Metadata } from 'next';
import Link from '@/components/link';
import { redirect } from 'next/navigation';
import { getActor } from '@/lib/server/auth/actor';
import { listMySeries } from '@/lib/server/series/list-my-series';

export const metadata: Metadata = { title: 'Series' };
export const dynamic = 'force-dynamic';

const ROLE_WORDS: Record<string, string> = { series_secretary: 'secretary', series_steward: 'series steward' };

// The series where the person is an official, with each class's parity history, bulletins and exports.
export default async function MySeriesPage() {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const series = await listMySeries(actor);
  return (
    <div className="space-y-6">
      <h1>Series</h1>
      {series.length === 0 ? (
        <p className="card">You are not an official of any series.</p>
      ) : (
        <ul className="space-y-3" data-testid="my-series">
          {series.map((s) => (
            <li key={s.id} className="card space-y-3" data-series-id={s.id}>
              <div>
                <h2 className="text-xl">{s.name}</h2>
                <p className="text-ink-soft">
                  Season {s.season} · you are {s.roles.map((r) => ROLE_WORDS[r] ?? r).join(' and ')}
                </p>
              </div>
              <div className="flex flex-wrap gap-2">
                <Link href={`/series/${s.id}`} className="btn-secondary">
                  Standings and bulletins
                </Link>
                {s.roles.includes('series_secretary') && (
                  <Link href={`/series/${s.id}/officials`} className="btn-secondary">
                    Officials and invitations
                  </Link>
                )}
                {s.classes.map((c) => (
                  <Link key={c.id} href={`/series/${s.id}/classes/${c.id}/parity`} className="btn-primary">
                    {c.code}: parity history, bulletins, exports
                  </Link>
                ))}
              </div>
              {s.classes.length === 0 && <p className="text-ink-soft">No classes in this series yet.</p>}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
