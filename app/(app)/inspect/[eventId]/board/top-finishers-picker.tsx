'use client';

import { useEffect, useState } from 'react';
import { requestJson } from '@/components/forms/request-json';
import type { ClassResultsView } from '@/lib/server/results/list-provisional-results';

/**
 * Post-race checks of the top finishers (common practice: the first few of each class are
 * re-inspected after the results): picks them from a class's latest provisional results.
 */
export function TopFinishersPicker({
  eventId,
  onPick,
}: {
  eventId: string;
  onPick: (entryIds: string[], reason: string) => void;
}) {
  const [classes, setClasses] = useState<ClassResultsView[] | null>(null);
  const [classId, setClassId] = useState('');
  const [count, setCount] = useState('3');
  const [note, setNote] = useState<string | null>(null);

  useEffect(() => {
    void requestJson<ClassResultsView[]>(`/api/events/${eventId}/results`, {
      method: 'GET',
      cache: 'no-store',
      fallbackMessage: (status) => `Results could not be loaded (${status}).`,
    }).then((answer) => {
      if (!answer.ok) return setNote(answer.message);
      const withResults = answer.data.filter((c) => c.latest && c.latest.rows.length > 0);
      setClasses(withResults);
      setClassId((id) => id || withResults[0]?.classId || '');
    });
  }, [eventId]);

  if (note && !classes) return <p className="text-base text-ink-soft">{note}</p>;
  if (!classes) return null;
  if (classes.length === 0)
    return (
      <p className="text-base text-ink-soft">
        No provisional results yet: once they are published, the top finishers can be chosen here.
      </p>
    );

  function pick() {
    const cls = classes!.find((c) => c.classId === classId);
    const n = Number(count);
    if (!cls?.latest || !Number.isInteger(n) || n < 1 || n > 50)
      return setNote('Choose a class and a number of finishers from 1 to 50.');
    const top = [...cls.latest.rows].sort((a, b) => a.position - b.position).filter((r) => r.position <= n);
    onPick(
      top.map((r) => r.entryId),
      `Post-race check: top ${n} in ${cls.classCode} (provisional results, version ${cls.latest.version})`,
    );
    setNote(`Chosen: ${top.map((r) => `no. ${r.raceNumber}`).join(', ')}.`);
  }

  return (
    <fieldset className="space-y-2 rounded-lg border border-paper-line p-3">
      <legend className="px-1 font-bold">Top finishers from the provisional results</legend>
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor="top-class" className="field-label text-base">
            Results of class
          </label>
          <select
            id="top-class"
            className="field-input min-h-touch"
            value={classId}
            onChange={(e) => setClassId(e.target.value)}
          >
            {classes.map((c) => (
              <option key={c.classId} value={c.classId}>
                {c.classCode} {c.className} (version {c.latest!.version})
              </option>
            ))}
          </select>
        </div>
        <div className="w-28">
          <label htmlFor="top-count" className="field-label text-base">
            How many
          </label>
          <input
            id="top-count"
            className="field-input min-h-touch"
            inputMode="numeric"
            value={count}
            onChange={(e) => setCount(e.target.value)}
          />
        </div>
        <button type="button" className="btn-secondary min-h-touch" onClick={pick}>
          Choose them
        </button>
      </div>
      {note && (
        <p role="status" className="text-base" data-testid="top-finishers-note">
          {note}
        </p>
      )}
    </fieldset>
  );
}
