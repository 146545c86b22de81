'use client';

import { useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { useJsonSubmit, FormMessage } from '@/components/ui/use-json-submit';
import { rowsToSend, type ResultsFormRow } from '@/lib/core/inputs/results';

type ClassOption = { classId: string; label: string };

/** Publish the next provisional results version of a class: typed in row by row, or uploaded as CSV. */
export function ResultsForm({ eventId, classes }: { eventId: string; classes: ClassOption[] }) {
  const router = useRouter();
  const { submit, isBusy, fieldErrors: serverErrors, message, setMessage } = useJsonSubmit();
  const nextKey = useRef(3);
  // A position left as it was follows the row's place (null), so removing a row renumbers the rest.
  const [rows, setRows] = useState<ResultsFormRow[]>([0, 1, 2].map((key) => ({ key, position: null, raceNumber: '' })));
  const [sentIndex, setSentIndex] = useState<number[]>([]);
  // The server names rows by their place in what was sent (blank rows are not sent): map back to the screen.
  const fieldErrors: Record<string, string> = {};
  for (const [k, v] of Object.entries(serverErrors)) {
    const m = /^rows\.(\d+)\.(.+)$/.exec(k);
    fieldErrors[m && sentIndex[+m[1]] !== undefined ? `rows.${sentIndex[+m[1]]}.${m[2]}` : k] = v;
  }
  const update = (i: number, change: Partial<ResultsFormRow>) => setRows((rs) => rs.map((r, j) => (j === i ? { ...r, ...change } : r)));
  const addRow = () => setRows((rs) => [...rs, { key: nextKey.current++, position: null, raceNumber: '' }]);
  const removeRow = (i: number) => { setRows((rs) => rs.filter((_, j) => j !== i)); setSentIndex([]); };
  const [csvError, setCsvError] = useState<string>();
  const [isUploading, setUploading] = useState(false);

  async function onForm(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const data = new FormData(e.currentTarget);
    const { send, screenIndex } = rowsToSend(rows);
    setSentIndex(screenIndex);
    const res = await submit(`/api/events/${eventId}/results`, { classId: data.get('classId'), rows: send, note: data.get('note') ?? '' });
    if (res.ok) { setMessage({ tone: 'ok', text: 'Published: the protest window is open for what changed.' }); router.refresh(); }
  }
  async function onCsv(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setCsvError(undefined);
    const data = new FormData(e.currentTarget);
    const file = data.get('file');
    if (!(file instanceof File) || file.size === 0) return setCsvError('Choose a CSV file.');
    setUploading(true);
    const res = await fetch(`/api/events/${eventId}/results`, { method: 'POST', body: data });
    const json = await res.json().catch(() => null);
    setUploading(false);
    if (!res.ok) return setCsvError(json?.error?.details?.find((d: { field: string }) => d.field === 'file')?.message ?? json?.error?.message ?? 'The upload failed.');
    setMessage({ tone: 'ok', text: 'Published from the CSV file.' });
    router.refresh();
  }

  const classSelect = (id: string) => (
    <div>
      <label htmlFor={id} className="field-label">Class</label>
      <select id={id} name="classId" className="field-input">{classes.map((c) => <option key={c.classId} value={c.classId}>{c.label}</option>)}</select>
    </div>
  );
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <form onSubmit={onForm} noValidate className="card space-y-3" aria-label="Enter results">
        <h2>Enter results</h2>
        <fieldset disabled={isBusy} className="space-y-3">
          {classSelect('results-class')}
          {fieldErrors.classId && <p className="field-error" data-field-error="classId">{fieldErrors.classId}</p>}
          {fieldErrors.rows && <p className="field-error" data-field-error="rows">{fieldErrors.rows}</p>}
          <p className="text-sm text-ink-soft">Rows without a race number are left out, whatever their position.</p>
          {rows.map((row, i) => (
            <div key={row.key} className="grid grid-cols-[1fr_1fr_auto] items-end gap-2" data-row={i}>
              <div>
                <label htmlFor={`position-${row.key}`} className="field-label">Position {i + 1}</label>
                <input id={`position-${row.key}`} inputMode="numeric" value={row.position ?? String(i + 1)} onChange={(e) => update(i, { position: e.target.value })} className="field-input" aria-invalid={fieldErrors[`rows.${i}.position`] ? true : undefined} />
                {fieldErrors[`rows.${i}.position`] && <p className="field-error" data-field-error={`rows.${i}.position`}>{fieldErrors[`rows.${i}.position`]}</p>}
              </div>
              <div>
                <label htmlFor={`raceNumber-${row.key}`} className="field-label">Race number {i + 1}</label>
                <input id={`raceNumber-${row.key}`} inputMode="numeric" value={row.raceNumber} onChange={(e) => update(i, { raceNumber: e.target.value })} className="field-input" aria-invalid={fieldErrors[`rows.${i}.raceNumber`] ? true : undefined} />
                {fieldErrors[`rows.${i}.raceNumber`] && <p className="field-error" data-field-error={`rows.${i}.raceNumber`}>{fieldErrors[`rows.${i}.raceNumber`]}</p>}
              </div>
              <button type="button" className="btn-secondary min-h-touch" aria-label={`Remove row ${i + 1}`} onClick={() => removeRow(i)} disabled={rows.length === 1}>Remove</button>
            </div>
          ))}
          <button type="button" className="btn-secondary" onClick={addRow}>Add a row</button>
          <div><label htmlFor="results-note" className="field-label">Note (optional)</label><input id="results-note" name="note" className="field-input" /></div>
          <button type="submit" className="btn-primary">Publish provisional results</button>
        </fieldset>
        <FormMessage message={message} />
      </form>
      <form onSubmit={onCsv} noValidate className="card space-y-3" aria-label="Upload results">
        <h2>Upload a CSV file</h2>
        <p className="text-sm text-ink-soft">A header line with <code>position,race_number</code>, then one finisher per line.</p>
        <fieldset disabled={isUploading} className="space-y-3">
          {classSelect('csv-class')}
          <div>
            <label htmlFor="results-file" className="field-label">CSV file</label>
            <input id="results-file" name="file" type="file" accept=".csv,text/csv" className="field-input" aria-invalid={csvError ? true : undefined} aria-describedby={csvError ? 'results-file-error' : undefined} />
            {csvError && <p id="results-file-error" className="field-error" data-field-error="file">{csvError}</p>}
          </div>
          <button type="submit" className="btn-primary">Upload and publish</button>
        </fieldset>
      </form>
    </div>
  );
}
