'use client';

import { useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { rowsToSend, type ResultsFormRow } from '@/lib/core/inputs/results';

type ClassOption = { classId: string; label: string };

/** Publish the next provisional results version of a class: typed in row by row, or uploaded as CSV. */
export function ResultsForm({ eventId, classes }: { eventId: string; classes: ClassOption[] }) {
  const router = useRouter();
  const nextKey = useRef(3);
  // A position left as it was follows the row's place (null), so removing a row renumbers the rest.
  const [rows, setRows] = useState<ResultsFormRow[]>([0, 1, 2].map((key) => ({ key, position: null, raceNumber: '' })));
  const [sentIndex, setSentIndex] = useState<number[]>([]);
  const update = (i: number, change: Partial<ResultsFormRow>) =>
    setRows((rs) => rs.map((r, j) => (j === i ? { ...r, ...change } : r)));
  const addRow = () => setRows((rs) => [...rs, { key: nextKey.current++, position: null, raceNumber: '' }]);
  const removeRow = (i: number) => {
    setRows((rs) => rs.filter((_, j) => j !== i));
    setSentIndex([]);
  };

  const typed = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const { send, screenIndex } = rowsToSend(rows);
      setSentIndex(screenIndex);
      const answer = await requestJson(`/api/events/${eventId}/results`, {
        body: { classId: data.get('classId'), rows: send, note: data.get('note') ?? '' },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Published: the protest window is open for what changed.' };
    },
    { ok: false },
  );
  const csv = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const file = data.get('file');
      if (!(file instanceof File) || file.size === 0) return { ok: false, fieldErrors: { file: 'Choose a CSV file.' } };
      const answer = await requestJson(`/api/events/${eventId}/results`, {
        body: data,
        fallbackMessage: 'The upload failed.',
      });
      if (!answer.ok) return { ok: false, fieldErrors: { file: answer.fieldErrors.file ?? answer.message } };
      router.refresh();
      return { ok: true, message: 'Published from the CSV file.' };
    },
    { ok: false },
  );

  // The server names rows by their place in what was sent (blank rows are not sent): map back to the screen.
  const fieldErrors: Record<string, string> = {};
  for (const [k, v] of Object.entries(typed.state.fieldErrors ?? {})) {
    const m = /^rows\.(\d+)\.(.+)$/.exec(k);
    fieldErrors[m && sentIndex[+m[1]] !== undefined ? `rows.${sentIndex[+m[1]]}.${m[2]}` : k] = v;
  }
  const csvError = csv.state.fieldErrors?.file;

  const classSelect = (id: string) => (
    <div>
      <label htmlFor={id} className="field-label">
        Class
      </label>
      <select id={id} name="classId" className="field-input">
        {classes.map((c) => (
          <option key={c.classId} value={c.classId}>
            {c.label}
          </option>
        ))}
      </select>
    </div>
  );
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <form {...typed.form} className="card space-y-3" aria-label="Enter results">
        <h2>Enter results</h2>
        <fieldset disabled={typed.isPending} className="space-y-3">
          {classSelect('results-class')}
          <FieldError name="classId" error={fieldErrors.classId} />
          <FieldError name="rows" error={fieldErrors.rows} />
          <p className="text-sm text-ink-soft">Rows without a race number are left out, whatever their position.</p>
          {rows.map((row, i) => (
            <div key={row.key} className="grid grid-cols-[1fr_1fr_auto] items-end gap-2" data-row={i}>
              <div>
                <label htmlFor={`position-${row.key}`} className="field-label">
                  Position {i + 1}
                </label>
                <input
                  id={`position-${row.key}`}
                  inputMode="numeric"
                  value={row.position ?? String(i + 1)}
                  onChange={(e) => update(i, { position: e.target.value })}
                  className="field-input"
                  aria-invalid={fieldErrors[`rows.${i}.position`] ? true : undefined}
                />
                {fieldErrors[`rows.${i}.position`] && (
                  <p className="field-error" data-field-error={`rows.${i}.position`}>
                    {fieldErrors[`rows.${i}.position`]}
                  </p>
                )}
              </div>
              <div>
                <label htmlFor={`raceNumber-${row.key}`} className="field-label">
                  Race number {i + 1}
                </label>
                <input
                  id={`raceNumber-${row.key}`}
                  inputMode="numeric"
                  value={row.raceNumber}
                  onChange={(e) => update(i, { raceNumber: e.target.value })}
                  className="field-input"
                  aria-invalid={fieldErrors[`rows.${i}.raceNumber`] ? true : undefined}
                />
                {fieldErrors[`rows.${i}.raceNumber`] && (
                  <p className="field-error" data-field-error={`rows.${i}.raceNumber`}>
                    {fieldErrors[`rows.${i}.raceNumber`]}
                  </p>
                )}
              </div>
              <button
                type="button"
                className="btn-secondary min-h-touch"
                aria-label={`Remove row ${i + 1}`}
                onClick={() => removeRow(i)}
                disabled={rows.length === 1}
              >
                Remove
              </button>
            </div>
          ))}
          <button type="button" className="btn-secondary" onClick={addRow}>
            Add a row
          </button>
          <div>
            <label htmlFor="results-note" className="field-label">
              Note (optional)
            </label>
            <input id="results-note" name="note" className="field-input" />
          </div>
          <FormMessage state={typed.state} />
          <button type="submit" className="btn-primary">
            Publish provisional results
          </button>
        </fieldset>
      </form>
      <form {...csv.form} className="card space-y-3" aria-label="Upload results">
        <h2>Upload a CSV file</h2>
        <p className="text-sm text-ink-soft">
          A header line with <code>position,race_number</code>, then one finisher per line.
        </p>
        <fieldset disabled={csv.isPending} className="space-y-3">
          {classSelect('csv-class')}
          <div>
            <label htmlFor="results-file" className="field-label">
              CSV file
            </label>
            <input
              id="results-file"
              name="file"
              type="file"
              accept=".csv,text/csv"
              className="field-input"
              aria-invalid={csvError ? true : undefined}
              aria-describedby={csvError ? 'results-file-error' : undefined}
            />
            <FieldError id="results-file-error" name="file" error={csvError} />
          </div>
          <FormMessage state={csv.state} testId="csv-message" />
          <button type="submit" className="btn-primary">
            Upload and publish
          </button>
        </fieldset>
      </form>
    </div>
  );
}
