import type { Metadata } from 'next';
import Link from '@/components/link';
import { notFound, redirect } from 'next/navigation';
import { getActor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { loadLogbook } from '@/lib/server/logbook/load-logbook';
import { LOGBOOK_KINDS, type LogbookItem, type LogbookKind } from '@/lib/core/logbook/logbook-record';
import {
  buildLogbookItems,
  describeComponent,
  groupLogbookItems,
  listSealsOnComponents,
  parseLogbookKinds,
  sortLogbookItems,
} from '@/lib/core/logbook/timeline';
import { formatCalendarDate, formatDay, safeTimeZone } from '@/lib/core/format/time';
import { SafetyNote } from '@/components/safety-note';
import { VerdictBadge } from '@/components/verdict-badge';
import { LogNoteForm } from './log-note-form';

export const metadata: Metadata = { title: 'Boat logbook' };
export const dynamic = 'force-dynamic';

function Item({ item }: { item: LogbookItem }) {
  return (
    <li className="space-y-1 py-3" data-testid="logbook-item" data-kind={item.kind} data-finding={item.finding ?? ''}>
      <p className="text-sm text-ink-mute">
        {LOGBOOK_KINDS[item.kind]} · {item.when}
      </p>
      <p className="break-words font-bold">{item.href ? <Link href={item.href}>{item.title}</Link> : item.title}</p>
      {(item.verdict || item.finding) && (
        <div className="flex flex-wrap gap-2">
          {item.verdict && <VerdictBadge verdict={item.verdict} />}
          {item.finding && (
            <span className="inline-flex items-center gap-2 rounded-full border-2 border-fail-600 bg-fail-100 px-3 py-1 font-bold text-fail-800">
              <span aria-hidden="true">✕</span> Seal {item.finding}
            </span>
          )}
        </div>
      )}
      <ul className="space-y-0.5 text-ink-soft">
        {item.lines.map((l, i) => (
          <li key={i} className="whitespace-pre-line break-words">
            {l}
          </li>
        ))}
      </ul>
    </li>
  );
}

// One boat's record across meetings: for its owner and for officials of a meeting it is entered in.
export default async function LogbookPage({
  params,
  searchParams,
}: {
  params: Promise<{ boatId: string }>;
  searchParams: Promise<{ kind?: string | string[] }>;
}) {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const { boatId } = await params;
  const book = await loadLogbook(actor, boatId).catch((err) => {
    if (err instanceof AppError && err.status === 404) notFound();
    throw err;
  });
  const { record } = book;
  const seals = listSealsOnComponents(record);
  const kinds = parseLogbookKinds((await searchParams).kind);
  const all = sortLogbookItems(buildLogbookItems(record, book.fallbackZone), 'newest');
  const counts = new Map<LogbookKind, number>();
  for (const i of all) counts.set(i.kind, (counts.get(i.kind) ?? 0) + 1);
  const isFiltered = kinds.length < Object.keys(LOGBOOK_KINDS).length;
  const groups = groupLogbookItems(
    all.filter((i) => kinds.includes(i.kind)),
    record.meetings,
  );
  const today = new Intl.DateTimeFormat('en-CA', { timeZone: safeTimeZone(book.fallbackZone) }).format(new Date());
  const chip = (active: boolean) =>
    `inline-flex min-h-touch items-center rounded-full border-2 px-3 text-sm font-bold no-underline ${active ? 'border-tide-700 bg-tide-700 text-white' : 'border-paper-line bg-white text-ink'}`;

  return (
    <div className="space-y-5">
      {book.isOwner && (
        <p>
          <Link href={`/boats/${record.boat.id}`}>← {record.boat.name}</Link>
        </p>
      )}
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="break-words" data-testid="logbook-heading">
          Logbook: {record.boat.name}
          {record.boat.hullNumber && (
            <span className="figure ml-2 text-2xl text-ink-mute">#{record.boat.hullNumber}</span>
          )}
        </h1>
        <a href={`/api/boats/${record.boat.id}/logbook/pdf`} className="btn-secondary" download>
          PDF to print and sign
        </a>
      </div>
      <p className="text-ink-soft">
        Everything recorded about this boat at every meeting, newest first. Nothing here is changed or removed: a
        correction is recorded as a new line.
      </p>
      <SafetyNote />

      <section className="card space-y-2" aria-labelledby="meetings-heading">
        <h2 id="meetings-heading" className="text-xl">
          Meetings ({record.meetings.length})
        </h2>
        {record.meetings.length === 0 ? (
          <p className="text-ink-mute">Not entered at any meeting yet.</p>
        ) : (
          <ul className="divide-y divide-paper-line">
            {record.meetings.map((m) => (
              <li key={m.id} className="py-2">
                <span className="font-bold">{m.name}</span> · {formatCalendarDate(m.startsOn)}
                <span className="block text-sm text-ink-soft">
                  {m.entries.map((e) => `no. ${e.raceNumber} ${e.classCode} ${e.className}`).join('; ')}
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>

      <section className="card space-y-2" aria-labelledby="components-heading">
        <h2 id="components-heading" className="text-xl">
          Components on the boat now ({record.components.length})
        </h2>
        {record.components.length === 0 ? (
          <p className="text-ink-mute">No engine, pump or impeller registered on this boat.</p>
        ) : (
          <ul className="divide-y divide-paper-line" data-testid="logbook-components">
            {record.components.map((c) => (
              <li key={c.id} className="break-words py-2">
                {describeComponent(c)}
                {c.trimCode && <span className="text-ink-soft"> · trim {c.trimCode}</span>}
                {(seals.get(c.id) ?? []).map((seal) => (
                  <span key={seal.sealNumber} className="block text-sm" data-testid="component-seal">
                    Seal {seal.sealNumber}
                    {seal.position && ` (${seal.position})`}: {seal.state}, {formatDay(seal.at, book.fallbackZone)}
                  </span>
                ))}
              </li>
            ))}
          </ul>
        )}
      </section>

      {book.noteMeetings.length > 0 && (
        <LogNoteForm boatId={record.boat.id} meetings={book.noteMeetings} today={today} />
      )}

      <nav aria-label="Show only" className="flex flex-wrap gap-2" data-testid="logbook-filters">
        <Link href={`/boats/${record.boat.id}/logbook`} className={chip(!isFiltered)}>
          Everything ({all.length})
        </Link>
        {(Object.keys(LOGBOOK_KINDS) as LogbookKind[])
          .filter((k) => counts.has(k))
          .map((k) => (
            <Link
              key={k}
              href={`/boats/${record.boat.id}/logbook?kind=${k}`}
              className={chip(isFiltered && kinds.includes(k))}
              aria-current={isFiltered && kinds.includes(k) ? 'page' : undefined}
            >
              {LOGBOOK_KINDS[k]} ({counts.get(k)})
            </Link>
          ))}
      </nav>

      {groups.length === 0 ? (
        <p className="card text-ink-mute">Nothing recorded yet.</p>
      ) : (
        groups.map((g, gi) => (
          <section key={`${g.key}-${gi}`} className="card" aria-labelledby={`group-${gi}`}>
            <h2 id={`group-${gi}`} className="break-words text-lg">
              {g.label}
            </h2>
            <ol className="divide-y divide-paper-line">
              {g.items.map((item) => (
                <Item key={item.id} item={item} />
              ))}
            </ol>
          </section>
        ))
      )}
    </div>
  );
}
