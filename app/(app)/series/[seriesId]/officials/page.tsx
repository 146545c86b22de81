import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { AppError } from '@/lib/core/errors';
import { formatTime } from '@/lib/core/format/time';
import { getActor } from '@/lib/server/auth/actor';
import { parseId } from '@/lib/server/http/ids';
import { listSeriesOfficials, type SeriesOfficialsView } from '@/lib/server/series/list-series-officials';
import { AppointOfficialForm } from './appoint-official-form';
import { SERIES_ROLE_LABEL } from './role-labels';

export const metadata: Metadata = { title: 'Series officials' };
export const dynamic = 'force-dynamic';

// For the series' secretary: who holds a series role, the invitations still open, and a form to invite more.
export default async function SeriesOfficialsPage({ params }: { params: Promise<{ seriesId: string }> }) {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  let seriesId: string;
  let view: SeriesOfficialsView;
  try {
    seriesId = parseId((await params).seriesId, 'series');
    view = await listSeriesOfficials(actor, seriesId);
  } catch (e) {
    if (e instanceof AppError && e.status === 404) notFound();
    if (e instanceof AppError && e.status === 403)
      return <p className="card">Only the series&apos; secretary sees and appoints its officials.</p>;
    throw e;
  }
  return (
    <article className="space-y-6">
      <h1>Series officials</h1>
      <section className="card space-y-2">
        <h2 className="text-xl">Officials</h2>
        <ul className="divide-y divide-paper-line" data-testid="series-officials">
          {view.officials.map((o) => (
            <li key={`${o.userId}-${o.role}`} className="flex flex-wrap justify-between gap-2 py-2">
              <span>
                {o.name ?? o.email} <span className="text-sm text-ink-mute">{o.email}</span>
              </span>
              <span>{SERIES_ROLE_LABEL[o.role]}</span>
            </li>
          ))}
        </ul>
      </section>
      <section className="card space-y-2">
        <h2 className="text-xl">Invitations waiting</h2>
        {view.pendingInvitations.length === 0 ? (
          <p className="text-ink-soft">No invitation is waiting.</p>
        ) : (
          <ul className="divide-y divide-paper-line" data-testid="series-invitations">
            {view.pendingInvitations.map((i) => (
              <li key={i.id} className="flex flex-wrap justify-between gap-2 py-2">
                <span>
                  {i.email}{' '}
                  <span className="text-sm text-ink-mute">
                    · holds the role once they accept the invitation from this mailbox
                  </span>
                </span>
                <span>
                  {SERIES_ROLE_LABEL[i.role]} · expires {formatTime(i.expiresAt, 'UTC')}
                </span>
              </li>
            ))}
          </ul>
        )}
        <AppointOfficialForm seriesId={seriesId} />
      </section>
    </article>
  );
}
