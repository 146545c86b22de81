import type { Metadata } from 'next';
import Link from '@/components/link';
import { redirect } from 'next/navigation';
import { getActor } from '@/lib/server/auth/actor';
import { listMyBoats } from '@/lib/server/boats/list-my-boats';
import { convertPower } from '@/lib/core/engine/units';
import { formatFigure } from '@/lib/core/entries/check-declaration';
import { formatFigure as formatPowerFigure } from '@/lib/core/format/figures';

export const metadata: Metadata = { title: 'My boats' };
export const dynamic = 'force-dynamic';

export default async function MyBoatsPage() {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const boats = await listMyBoats(actor);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>My boats</h1>
        <Link href="/boats/new" className="btn-primary">
          Register a boat
        </Link>
      </div>
      {boats.length === 0 ? (
        <p className="card text-ink-soft">
          No boats yet. Register one with its pump, nozzle and engine, then enter it at a meeting.
        </p>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2" data-testid="my-boats">
          {boats.map((b) => (
            <li key={b.id} className="card space-y-2">
              <h2 className="text-xl">
                <Link href={`/boats/${b.id}`}>{b.name}</Link>
                {b.hullNumber && <span className="figure ml-2 text-base text-ink-mute">#{b.hullNumber}</span>}
              </h2>
              <dl className="grid grid-cols-[9rem_1fr] gap-y-1 text-base">
                <dt className="text-ink-soft">Nozzle exit</dt>
                <dd className="figure">
                  {formatFigure(b.declaredNozzleMm, 2)} mm ± {formatFigure(b.declaredNozzleToleranceMm, 2)} mm
                </dd>
                <dt className="text-ink-soft">Power</dt>
                <dd className="figure">
                  {formatPowerFigure(b.declaredPowerKw, 'powerKw')} (
                  {formatPowerFigure(convertPower(b.declaredPowerKw, 'kW', 'hp'), 'powerHp')})
                </dd>
              </dl>
              <div className="flex flex-wrap gap-2 pt-1">
                <Link href={`/boats/${b.id}`} className="btn-secondary">
                  Declaration and tag
                </Link>
                <Link href={`/boats/${b.id}/enter`} className="btn-primary">
                  Enter a meeting
                </Link>
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
