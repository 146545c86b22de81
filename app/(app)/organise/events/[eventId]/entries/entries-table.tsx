'use client';

import { useEffect, useMemo, useRef, useState } from 'react';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import type { EventEntryRow } from '@/lib/server/entries/list-event-entries';
import { figureValue } from '@/lib/core/format/figures';
import { StatusBadge } from '@/components/status-badge';
import { CancelEntryButton } from './cancel-entry-button';

const col = createColumnHelper<EventEntryRow>();
const PAGE_SIZE = 20;
// Typing waits this long after the last key before the search goes into the URL, so the whole word counts.
const SEARCH_DEBOUNCE_MS = 300;

/** Entries with search, class and status filters, sorting and paging, all kept in the URL. */
export function EntriesTable({
  rows,
  classes,
  canCancel,
  eventId,
}: {
  rows: EventEntryRow[];
  classes: { id: string; label: string }[];
  canCancel: boolean;
  eventId: string;
}) {
  const router = useRouter();
  const pathname = usePathname();
  const params = useSearchParams();
  const q = params.get('q') ?? '';
  const classId = params.get('class') ?? '';
  const status = params.get('status') ?? '';
  const sort = params.get('sort') ?? 'raceNumber';
  const desc = params.get('dir') === 'desc';
  const page = Math.max(0, Number(params.get('page') ?? '1') - 1);

  const setParam = (changes: Record<string, string | null>) => {
    // Read the address as it is now (not as it was at the last render), so a debounced search and a
    // filter change never undo each other.
    const next = new URLSearchParams(typeof window === 'undefined' ? params : window.location.search);
    for (const [k, v] of Object.entries(changes)) {
      if (v) next.set(k, v);
      else next.delete(k);
    }
    if (!('page' in changes)) next.delete('page');
    router.replace(`${pathname}?${next.toString()}`, { scroll: false });
  };

  // The search box is controlled by what the person types; the URL follows it after a pause (or at
  // once on Enter). The box only takes the URL's value when the URL changed by other means (back,
  // a link), never while someone is typing, so no keystroke is lost while the URL updates.
  const [text, setText] = useState(q);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const sentQ = useRef(q);
  useEffect(() => {
    if (q !== sentQ.current) {
      sentQ.current = q;
      if (!timer.current) setText(q);
    }
  }, [q]);
  useEffect(
    () => () => {
      if (timer.current) clearTimeout(timer.current);
    },
    [],
  );
  const applySearch = (value: string) => {
    if (timer.current) {
      clearTimeout(timer.current);
      timer.current = null;
    }
    const v = value.trim();
    if (v === (sentQ.current ?? '')) return;
    sentQ.current = v;
    setParam({ q: v || null });
  };
  const onSearchInput = (value: string) => {
    setText(value);
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      timer.current = null;
      applySearch(value);
    }, SEARCH_DEBOUNCE_MS);
  };

  const filtered = useMemo(
    () =>
      rows.filter(
        (r) => (!classId || r.classId === classId) && (!status || r.status === status || r.inspectionResult === status),
      ),
    [rows, classId, status],
  );

  const columns = useMemo(
    () => [
      col.accessor('raceNumber', {
        header: 'No.',
        cell: (c) => <span className="figure font-bold">{c.getValue()}</span>,
      }),
      col.accessor('boatName', { header: 'Boat' }),
      col.accessor((r) => `${r.classCode}`, { id: 'classCode', header: 'Class' }),
      col.accessor((r) => r.entrantName ?? r.entrantEmail, { id: 'entrant', header: 'Entrant' }),
      col.accessor('status', {
        header: 'Status',
        cell: (c) => <StatusBadge status={c.getValue()} inspection={c.row.original.inspectionResult} />,
      }),
      col.accessor('declaredNozzleMm', {
        header: 'Nozzle (mm)',
        cell: (c) => <span className="figure">{figureValue(c.getValue(), 'nozzleMm')}</span>,
      }),
      col.accessor('declaredPowerKw', {
        header: 'Power (kW)',
        cell: (c) => <span className="figure">{figureValue(c.getValue(), 'powerKw')}</span>,
      }),
      ...(canCancel
        ? [
            col.display({
              id: 'actions',
              header: '',
              cell: (c) => <CancelEntryButton eventId={eventId} entry={c.row.original} />,
            }),
          ]
        : []),
    ],
    [canCancel, eventId],
  );

  // Stable between renders: a new sorting array each render re-sorts the rows, which made the table
  // reset its page, re-render and sort again without end (the page froze after the first key typed).
  const sorting: SortingState = useMemo(() => [{ id: sort, desc }], [sort, desc]);
  // TanStack Table returns functions the React Compiler cannot memoise; this app does not use the compiler.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: filtered,
    columns,
    // The page lives in the URL; changing a filter drops it there (setParam), never through the table.
    autoResetPageIndex: false,
    state: { globalFilter: q, sorting, pagination: { pageIndex: page, pageSize: PAGE_SIZE } },
    onSortingChange: (updater) => {
      const s = typeof updater === 'function' ? updater(sorting) : updater;
      setParam({ sort: s[0]?.id ?? null, dir: s[0]?.desc ? 'desc' : null });
    },
    globalFilterFn: (row, _id, value: string) => {
      const v = value.toLowerCase();
      const r = row.original;
      return [r.boatName, r.hullNumber, r.entrantName ?? '', r.entrantEmail, String(r.raceNumber)].some((s) =>
        s.toLowerCase().includes(v),
      );
    },
    getCoreRowModel: getCoreRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
  });
  const pageCount = Math.max(1, table.getPageCount());

  return (
    <div className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-3">
        <div>
          <label htmlFor="q" className="field-label">
            Search
          </label>
          <input
            id="q"
            type="search"
            className="field-input"
            value={text}
            placeholder="Boat, number, entrant"
            enterKeyHint="search"
            autoComplete="off"
            onChange={(e) => onSearchInput(e.target.value)}
            onKeyDown={(e) => {
              if (e.key === 'Enter') {
                e.preventDefault();
                applySearch(e.currentTarget.value);
              }
            }}
          />
        </div>
        <div>
          <label htmlFor="class-filter" className="field-label">
            Class
          </label>
          <select
            id="class-filter"
            className="field-input"
            value={classId}
            onChange={(e) => setParam({ class: e.target.value || null })}
          >
            <option value="">All classes</option>
            {classes.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="status-filter" className="field-label">
            Status
          </label>
          <select
            id="status-filter"
            className="field-input"
            value={status}
            onChange={(e) => setParam({ status: e.target.value || null })}
          >
            <option value="">Any status</option>
            <option value="awaiting_payment">Awaiting payment</option>
            <option value="entered">Entered (paid)</option>
            <option value="conforms">Inspected: conforms</option>
            <option value="does_not_conform">Inspected: does not conform</option>
            <option value="inconclusive">Inspected: inconclusive</option>
            <option value="withdrawn">Withdrawn</option>
            <option value="cancelled">Cancelled</option>
          </select>
        </div>
      </div>
      <p className="text-sm text-ink-mute" aria-live="polite" data-testid="entries-count">
        {table.getFilteredRowModel().rows.length} of {rows.length} entries
      </p>
      <div className="card overflow-x-auto p-0" tabIndex={0} role="region" aria-label="Entries">
        <table className="w-full min-w-[40rem] text-left" data-testid="entries-table">
          <thead className="bg-paper-deep">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => (
                  <th
                    key={h.id}
                    className="p-3"
                    aria-sort={
                      h.column.getIsSorted()
                        ? h.column.getIsSorted() === 'desc'
                          ? 'descending'
                          : 'ascending'
                        : undefined
                    }
                  >
                    {h.column.getCanSort() ? (
                      <button
                        type="button"
                        className="inline-flex min-h-[44px] min-w-[44px] items-center font-bold"
                        onClick={h.column.getToggleSortingHandler()}
                      >
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        {{ asc: ' ▲', desc: ' ▼' }[h.column.getIsSorted() as string] ?? ''}
                      </button>
                    ) : (
                      flexRender(h.column.columnDef.header, h.getContext())
                    )}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((r) => (
              <tr key={r.id} className="border-t border-paper-line">
                {r.getVisibleCells().map((c) => (
                  <td key={c.id} className="p-3">
                    {flexRender(c.column.columnDef.cell, c.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {table.getRowModel().rows.length === 0 && (
              <tr>
                <td colSpan={columns.length} className="p-4">
                  No entries match.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      <div className="flex items-center gap-3">
        <button
          type="button"
          className="btn-secondary"
          disabled={page === 0}
          onClick={() => setParam({ page: String(page) })}
        >
          Previous
        </button>
        <span>
          Page {page + 1} of {pageCount}
        </span>
        <button
          type="button"
          className="btn-secondary"
          disabled={page + 1 >= pageCount}
          onClick={() => setParam({ page: String(page + 2) })}
        >
          Next
        </button>
      </div>
    </div>
  );
}
