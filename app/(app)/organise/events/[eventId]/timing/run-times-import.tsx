'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { ClassAndCourseFields, type ClassOption } from './class-course-fields';

type Line = {
  line: number;
  raceNumber: string;
  run: string;
  elapsed: string;
  boatName: string | null;
  status: 'new' | 'unchanged' | 'correction' | 'error';
  message: string;
};
type Outcome = { stored: number; corrected: number; unchanged: number; lines: Line[] };

const STATUS_WORDS: Record<Line['status'], string> = {
  new: 'New',
  unchanged: 'Already stored',
  correction: 'Correction',
  error: 'Refused',
};

/** Import a timing CSV: a preview shows what happens to each line before anything is stored. */
export function RunTimesImport({ eventId, classes }: { eventId: string; classes: ClassOption[] }) {
  const router = useRouter();
  const [preview, setPreview] = useState<{ lines: Line[]; form: FormData; done?: boolean } | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});

  const check = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      setPreview(null);
      const file = data.get('file');
      if (!(file instanceof File) || file.size === 0) {
        setFieldErrors({ file: 'Choose a CSV file.' });
        return { ok: false };
      }
      const answer = await requestJson<{ lines: Line[] }>(`/api/events/${eventId}/run-times/preview`, {
        body: data,
        fallbackMessage: 'The preview failed.',
      });
      if (!answer.ok) {
        setFieldErrors({ file: answer.fieldErrors.file ?? answer.message, ...answer.fieldErrors });
        return { ok: false };
      }
      setFieldErrors({});
      setPreview({ lines: answer.data.lines, form: data });
      const bad = answer.data.lines.filter((l) => l.status === 'error').length;
      return bad
        ? {
            ok: false,
            message: `${bad} line${bad === 1 ? '' : 's'} refused: fix the file and preview it again. Nothing was stored.`,
          }
        : { ok: true, message: 'Nothing stored yet: check the lines, then import.' };
    },
    { ok: false },
  );
  const commit = useFormAction(
    async (): Promise<FormState> => {
      if (!preview) return { ok: false };
      const answer = await requestJson<Outcome>(`/api/events/${eventId}/run-times`, {
        body: preview.form,
        fallbackMessage: 'The import failed.',
      });
      if (!answer.ok) return { ok: false, message: answer.fieldErrors.file ?? answer.message };
      setPreview({ lines: answer.data.lines, form: preview.form, done: true });
      router.refresh();
      const d = answer.data;
      return {
        ok: true,
        message: `Stored ${d.stored} new run${d.stored === 1 ? '' : 's'}, ${d.corrected} correction${d.corrected === 1 ? '' : 's'}; ${d.unchanged} already stored.`,
      };
    },
    { ok: false },
  );
  const hasErrors = preview?.lines.some((l) => l.status === 'error') ?? true;
  const toStore = preview?.lines.filter((l) => l.status === 'new' || l.status === 'correction').length ?? 0;

  return (
    <div className="card space-y-3">
      <form {...check.form} aria-label="Preview a timing file" className="space-y-3">
        <h2>Import a timing file (CSV)</h2>
        <p className="text-sm text-ink-soft">
          Header line: <code>race_number,run,elapsed_s</code>, then optional <code>trap_speed_kmh</code> (or{' '}
          <code>_mph</code>, <code>_ms</code>, <code>_kn</code>), <code>gps_top_speed_kmh</code>, <code>rpm</code>,{' '}
          <code>conditions</code>. Times in seconds (41.25) or minutes and seconds (1:02.5). At most 256 KB.
        </p>
        <fieldset disabled={check.isPending || commit.isPending} className="space-y-3">
          <ClassAndCourseFields idPrefix="import" classes={classes} errors={fieldErrors} isCourseRequired />
          <div>
            <label htmlFor="import-file" className="field-label">
              CSV file
            </label>
            <input
              id="import-file"
              name="file"
              type="file"
              accept=".csv,text/csv"
              className="field-input"
              aria-invalid={fieldErrors.file ? true : undefined}
              aria-describedby={fieldErrors.file ? 'import-file-error' : undefined}
              onChange={() => setPreview(null)}
            />
            <FieldError id="import-file-error" name="file" error={fieldErrors.file} />
          </div>
          <FormMessage state={check.state} testId="preview-message" />
          <button type="submit" className="btn-secondary">
            Preview
          </button>
        </fieldset>
      </form>
      {preview && (
        <div className="space-y-3">
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Preview of the file">
            <table className="w-full text-left text-sm" data-testid="run-preview">
              <thead className="bg-paper-deep">
                <tr>
                  <th className="p-2">Line</th>
                  <th className="p-2">No.</th>
                  <th className="p-2">Run</th>
                  <th className="p-2">Time</th>
                  <th className="p-2">What happens</th>
                </tr>
              </thead>
              <tbody>
                {preview.lines.map((l) => (
                  <tr key={l.line} className="border-t border-paper-line" data-status={l.status}>
                    <td className="figure p-2">{l.line}</td>
                    <td className="figure p-2">
                      {l.raceNumber}
                      {l.boatName && <span className="block text-xs text-ink-soft">{l.boatName}</span>}
                    </td>
                    <td className="p-2">{l.run}</td>
                    <td className="figure p-2">{l.elapsed}</td>
                    <td className={`min-w-48 p-2 ${l.status === 'error' ? 'field-error' : ''}`}>
                      <strong>{STATUS_WORDS[l.status]}.</strong> {l.message}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <form {...commit.form} aria-label="Import the previewed file">
            <FormMessage state={commit.state} testId="import-message" />
            {!preview.done && (
              <button type="submit" className="btn-primary" disabled={hasErrors || toStore === 0 || commit.isPending}>
                {hasErrors
                  ? 'Fix the refused lines first'
                  : toStore === 0
                    ? 'Nothing new to store'
                    : `Import ${toStore} run${toStore === 1 ? '' : 's'}`}
              </button>
            )}
          </form>
        </div>
      )}
    </div>
  );
}
