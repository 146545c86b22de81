'use client';

import { useRouter } from 'next/navigation';
import { EVIDENCE_MAX_BYTES } from '@/lib/core/protests/protest-states';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

type Evidence = { kind: 'file' | 'note'; fileName?: string; sha256?: string };

/** Add a file (photo, PDF, video) or a written note; a refused file gets its reason beside the file field. */
export function EvidenceForm({ protestId }: { protestId: string }) {
  const router = useRouter();
  async function send(field: 'file' | 'note', body: FormData | { kind: 'note'; note: string }): Promise<FormState> {
    const answer = await requestJson<Evidence>(`/api/protests/${protestId}/evidence`, {
      body,
      fallbackMessage: 'Nothing was added. Try again.',
    });
    // Whatever the server says is about the one field this form has.
    if (!answer.ok) return { ok: false, fieldErrors: { [field]: answer.fieldErrors[field] ?? answer.message } };
    router.refresh();
    const e = answer.data;
    return {
      ok: true,
      message: e.kind === 'file' ? `Added ${e.fileName} (SHA-256 ${e.sha256?.slice(0, 12)}…).` : 'Note added.',
    };
  }

  const file = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const f = data.get('file');
      if (!(f instanceof File) || f.size === 0) return { ok: false, fieldErrors: { file: 'Choose a file to add.' } };
      if (f.size > EVIDENCE_MAX_BYTES)
        return {
          ok: false,
          fieldErrors: { file: `This file is ${(f.size / 1048576).toFixed(1)} MB; the limit is 40 MB.` },
        };
      return send('file', data);
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const note = useFormAction(
    async (_prev: FormState, data: FormData) => send('note', { kind: 'note', note: String(data.get('note') ?? '') }),
    { ok: false },
    { resetOnSuccess: true },
  );
  const isBusy = file.isPending || note.isPending;
  const fileError = file.state.fieldErrors?.file;
  const noteError = note.state.fieldErrors?.note;

  return (
    <div className="space-y-3 rounded-lg bg-paper-deep p-4">
      <h3>Add evidence</h3>
      <p className="text-sm text-ink-soft">
        Evidence is kept as it was added, with its SHA-256: it cannot be replaced or deleted.
      </p>
      <form {...file.form} aria-label="Add a file">
        <fieldset disabled={isBusy} className="grid gap-3 sm:grid-cols-[1fr_auto] sm:items-end">
          <div>
            <label htmlFor="evidence-file" className="field-label">
              Photo, PDF or video
            </label>
            <input
              id="evidence-file"
              name="file"
              type="file"
              accept="image/*,application/pdf,video/mp4,video/quicktime"
              className="field-input"
              aria-invalid={fileError ? true : undefined}
              aria-describedby={fileError ? 'evidence-file-error' : undefined}
            />
            <FieldError id="evidence-file-error" name="file" error={fileError} />
          </div>
          <FormMessage state={file.state} testId="evidence-message" className="sm:col-span-2" />
          <button type="submit" className="btn-primary justify-self-start">
            Add the file
          </button>
        </fieldset>
      </form>
      <form {...note.form} aria-label="Add a note">
        <fieldset disabled={isBusy} className="space-y-2">
          <label htmlFor="evidence-note" className="field-label">
            Note or witness statement
          </label>
          <textarea
            id="evidence-note"
            name="note"
            rows={3}
            className="field-input"
            aria-invalid={noteError ? true : undefined}
            aria-describedby={noteError ? 'evidence-note-error' : undefined}
          />
          <FieldError id="evidence-note-error" name="note" error={noteError} />
          <FormMessage state={note.state} testId="evidence-note-message" />
          <button type="submit" className="btn-secondary">
            Add the note
          </button>
        </fieldset>
      </form>
    </div>
  );
}
