'use client';

import { useMemo, useState } from 'react';
import type { PersonView } from '@/lib/server/admin/person-view';
import { SuspensionControl } from './suspension-control';
import { AppealBodyControl } from './appeal-body-control';

/** Everyone with an account, narrowed as the administrator types (name or e-mail) or to the suspended. */
export function PeopleList({
  people,
  actorId,
  labels,
}: {
  people: PersonView[];
  actorId: string;
  labels: Record<string, { joined: string; suspended: string | null }>;
}) {
  const [q, setQ] = useState('');
  const [suspendedOnly, setSuspendedOnly] = useState(false);
  const shown = useMemo(() => {
    const needle = q.trim().toLowerCase();
    return people.filter(
      (p) =>
        (!suspendedOnly || p.suspendedAt) && (!needle || `${p.name ?? ''} ${p.email}`.toLowerCase().includes(needle)),
    );
  }, [people, q, suspendedOnly]);
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <div className="min-w-[14rem] flex-1">
          <label htmlFor="people-search" className="field-label">
            Find a person
          </label>
          <input
            id="people-search"
            type="search"
            className="field-input"
            placeholder="Name or e-mail"
            value={q}
            onChange={(e) => setQ(e.target.value)}
          />
        </div>
        <label className="inline-flex min-h-touch items-center gap-2">
          <input type="checkbox" checked={suspendedOnly} onChange={(e) => setSuspendedOnly(e.target.checked)} />{' '}
          Suspended only
        </label>
      </div>
      <p className="text-sm text-ink-soft" aria-live="polite" data-testid="people-count">
        Showing {shown.length} of {people.length}
      </p>
      <ul className="space-y-3" data-testid="people">
        {shown.map((p) => (
          <li key={p.id} className="card flex flex-wrap items-start justify-between gap-3" data-person={p.email}>
            <div className="min-w-0 space-y-1">
              <p className="font-bold">
                {p.name ?? '—'}{' '}
                {p.isAdmin && (
                  <span className="ml-1 rounded-full bg-tide-100 px-2 py-0.5 text-sm text-tide-700">site admin</span>
                )}
                {p.isAppealBody && (
                  <span
                    className="ml-1 rounded-full bg-tide-100 px-2 py-0.5 text-sm text-tide-700"
                    data-testid="appeal-body-badge"
                  >
                    appeal body
                  </span>
                )}
              </p>
              <p className="break-all text-ink-soft">{p.email}</p>
              <p className="text-sm text-ink-mute">Joined {labels[p.id].joined}</p>
              {p.suspendedAt && (
                <p
                  className="rounded-lg border-l-8 border-fail-600 bg-fail-100 px-3 py-2 text-fail-800"
                  data-testid="suspended"
                >
                  Suspended {labels[p.id].suspended}: {p.suspendedReason}
                </p>
              )}
            </div>
            <div className="flex flex-wrap gap-2 sm:flex-col sm:items-end">
              <SuspensionControl person={p} isSelf={p.id === actorId} />
              <AppealBodyControl person={p} />
            </div>
          </li>
        ))}
      </ul>
      {shown.length === 0 && <p className="card text-ink-soft">Nobody matches.</p>}
    </div>
  );
}
