'use client';

import { useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { ClassAndCourseFields, type ClassOption } from './class-course-fields';
import { numberOrNull } from '@/lib/core/inputs/form-values';

type Row = {
  key: number;
  raceNumber: string;
  runLabel: string;
  elapsedS: string;
  trapSpeedKmh: string;
  gpsTopSpeedKmh: string;
  rpm: string;
  conditions: string;
};
const blank = (key: number): Row => ({
  key,
  raceNumber: '',
  runLabel: '',
  elapsedS: '',
  trapSpeedKmh: '',
  gpsTopSpeedKmh: '',
  rpm: '',
  conditions: '',
});
const FIELDS: { name: keyof Omit<Row, 'key'>; label: string; numeric?: boolean }[] = [
  { name: 'raceNumber', label: 'Race number', numeric: true },
  { name: 'runLabel', label: 'Run or heat' },
  { name: 'elapsedS', label: 'Time (s)', numeric: true },
  { name: 'trapSpeedKmh', label: 'Trap (km/h)', numeric: true },
  { name: 'gpsTopSpeedKmh', label: 'GPS top (km/h)', numeric: true },
  { name: 'rpm', label: 'rpm', numeric: true },
  { name: 'conditions', label: 'Conditions' },
];

/** A few runs typed by hand; a run already stored with other figures is stored as its correction. */
export function RunTimesEntryForm({ eventId, classes }: { eventId: string; classes: ClassOption[] }) {
  const router = useRouter();
  const nextKey = useRef(2);
  const [rows, setRows] = useState<Row[]>([blank(0), blank(1)]);
  const [sentIndex, setSentIndex] = useState<number[]>([]);
  const update = (i: number, change: Partial<Row>) =>
    setRows((rs) => rs.map((r, j) => (j === i ? { ...r, ...change } : r)));

  const form = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const filled = rows.map((r, i) => [r, i] as const).filter(([r]) => r.raceNumber.trim() !== '');
      setSentIndex(filled.map(([, i]) => i));
      const optional = (v: string) => (v.trim() === '' ? null : numberOrNull(v));
      const answer = await requestJson<{ stored: number; corrected: number; unchanged: number }>(
        `/api/events/${eventId}/run-times`,
        {
          body: {
            classId: data.get('classId'),
            courseLengthM: numberOrNull(data.get('courseLengthM')),
            rows: filled.map(([r]) => ({
              raceNumber: numberOrNull(r.raceNumber),
              runLabel: r.runLabel,
              elapsedS: numberOrNull(r.elapsedS),
              trapSpeedKmh: optional(r.trapSpeedKmh),
              gpsTopSpeedKmh: optional(r.gpsTopSpeedKmh),
              rpm: optional(r.rpm),
              conditions: r.conditions,
            })),
          },
        },
      );
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      const d = answer.data;
      return {
        ok: true,
        message: `Stored ${d.stored} new run${d.stored === 1 ? '' : 's'}, ${d.corrected} correction${d.corrected === 1 ? '' : 's'}; ${d.unchanged} already stored.`,
      };
    },
    { ok: false },
  );
  // The server numbers rows as sent (blank rows are not sent): map back to the screen's rows.
  const errors: Record<string, string> = {};
  for (const [k, v] of Object.entries(form.state.fieldErrors ?? {})) {
    const m = /^rows\.(\d+)\.(.+)$/.exec(k);
    errors[m && sentIndex[+m[1]] !== undefined ? `rows.${sentIndex[+m[1]]}.${m[2]}` : k] = v;
  }
  return (
    <form {...form.form} className="card space-y-3" aria-label="Type in run times">
      <h2>Type in a few runs</h2>
      <fieldset disabled={form.isPending} className="space-y-3">
        <div className="grid gap-2 sm:grid-cols-2">
          <ClassAndCourseFields idPrefix="entry" classes={classes} errors={errors} />
        </div>
        <FieldError name="rows" error={errors.rows} />
        {rows.map((row, i) => (
          <fieldset key={row.key} className="rounded border border-paper-line p-2" data-row={i}>
            <legend className="px-1 text-sm font-bold">Run {i + 1}</legend>
            <div className="grid grid-cols-2 gap-2 sm:grid-cols-4">
              {FIELDS.map((f) => {
                const err = errors[`rows.${i}.${f.name}`];
                const id = `run-${row.key}-${f.name}`;
                return (
                  <div key={f.name} className={f.name === 'conditions' ? 'col-span-2' : ''}>
                    <label htmlFor={id} className="field-label">
                      {f.label}
                    </label>
                    <input
                      id={id}
                      inputMode={f.numeric ? 'decimal' : undefined}
                      value={row[f.name]}
                      onChange={(e) => update(i, { [f.name]: e.target.value })}
                      className="field-input"
                      aria-invalid={err ? true : undefined}
                      aria-describedby={err ? `${id}-error` : undefined}
                    />
                    {err && (
                      <p id={`${id}-error`} className="field-error" data-field-error={`rows.${i}.${f.name}`}>
                        {err}
                      </p>
                    )}
                  </div>
                );
              })}
            </div>
          </fieldset>
        ))}
        <button
          type="button"
          className="btn-secondary"
          onClick={() => setRows((rs) => [...rs, blank(nextKey.current++)])}
        >
          Add a run
        </button>
        <FormMessage state={form.state} testId="entry-message" />
        <button type="submit" className="btn-primary">
          Store these runs
        </button>
      </fieldset>
    </form>
  );
}
