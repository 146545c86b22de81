import type { Metadata } from 'next';
import Link from '@/components/link';
import { Suspense } from 'react';
import { can } from '@/lib/server/auth/actor';
import { listEventEntries } from '@/lib/server/entries/list-event-entries';
import { openEntries } from '../access';
import { EntriesTable } from './entries-table';

export const metadata: Metadata = { title: 'Entries' };

export default async function EntriesPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId, event } = await openEntries(params);
  const rows = await listEventEntries(actor, eventId);
  const classes = [
    ...new Map(rows.map((r) => [r.classId, { id: r.classId, label: `${r.classCode} ${r.className}` }])).values(),
  ];
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/organise">Organise</Link> / <Link href={`/organise/events/${eventId}`}>{event.name}</Link> /
        Entries
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Entries</h1>
        <div className="flex flex-wrap gap-2">
          <a href={`/api/events/${eventId}/entries/export`} className="btn-secondary">
            Export CSV
          </a>
          <a
            href={`/api/events/${eventId}/tag-sheet?sheet=a4-2x7`}
            className="btn-secondary"
            data-testid="tag-sheet-link"
          >
            Tag sheet (PDF)
          </a>
        </div>
      </div>
      <Suspense fallback={<p>Loading the table…</p>}>
        <EntriesTable
          rows={rows}
          classes={classes}
          canCancel={can(actor, 'entry.cancel', { eventId })}
          eventId={eventId}
        />
      </Suspense>
    </div>
  );
}
