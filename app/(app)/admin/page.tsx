import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { format } from 'date-fns';
import { getActor, can } from '@/lib/auth/actor';
import { listPeople } from '@/lib/admin/list-people';
import { formatInZone } from '@/lib/protests/protest-window';
import { SuspensionControl } from './suspension-control';

export const metadata: Metadata = { title: 'Administration' };

export default async function AdminPage() {
  const actor = await getActor();
  if (!can(actor, 'admin.manage_users')) redirect('/not-allowed');
  const people = await listPeople(actor);
  const suspended = people.filter((p) => p.suspendedAt).length;
  return (
    <div className="space-y-4">
      <h1>Administration</h1>
      <h2 className="text-xl">People ({people.length}{suspended ? `, ${suspended} suspended` : ''})</h2>
      <ul className="space-y-3" data-testid="people">
        {people.map((p) => (
          <li key={p.id} className="card flex flex-wrap items-start justify-between gap-3" data-person={p.email}>
            <div className="min-w-0 space-y-1">
              <p className="font-bold">{p.name ?? '—'} {p.isAdmin && <span className="ml-1 rounded-full bg-tide-100 px-2 py-0.5 text-sm text-tide-700">site admin</span>}</p>
              <p className="break-all text-ink-soft">{p.email}</p>
              <p className="text-sm text-ink-mute">Joined {format(new Date(p.createdAt), 'd MMM yyyy')}</p>
              {p.suspendedAt && (
                <p className="rounded-lg border-l-8 border-fail-600 bg-fail-100 px-3 py-2 text-fail-800" data-testid="suspended">
                  Suspended {formatInZone(p.suspendedAt, 'UTC')}: {p.suspendedReason}
                </p>
              )}
            </div>
            <SuspensionControl person={p} isSelf={p.id === actor!.id} />
          </li>
        ))}
      </ul>
    </div>
  );
}
