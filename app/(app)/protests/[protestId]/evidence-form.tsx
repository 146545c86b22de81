'use client';

import { useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { EVIDENCE_MAX_BYTES } from '@/lib/core/protests/protest-states';

/** Add a file (photo, PDF, video) or a written note; a refused file gets its reason beside the file field. */
export function EvidenceForm({ protestId }: { protestId: string }) {
  const router = useRouter();
  const fileForm = useRef<HTMLFormElement>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string>();
  const [isBusy, setBusy] = useState(false);

  async function send(body: BodyInit, headers: HeadersInit, field: string, done: () => void) {
    setBusy(true);
    setErrors({});
    setMessage(undefined);
    const res = await fetch(`/api/protests/${protestId}/evidence`, { method: 'POST', body, headers });
    const json = await res.json().catch(() => null);
    setBusy(false);
    if (!res.ok) {
      const d = (json?.error?.details ?? []) as { field: string; message: string }[];
      return setErrors({ [field]: d.find((x) => x.field === field)?.message ?? json?.error?.message ?? 'Nothing was added. Try again.' });
    }
    done();
    setMessage(json.data.kind === 'file' ? `Added ${json.data.fileName} (SHA-256 ${json.data.sha256.slice(0, 12)}…).` : 'Note added.');
    router.refresh();
  }

  function onFile(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const data = new FormData(e.currentTarget);
    const file = data.get('file');
    if (!(file instanceof File) || file.size === 0) return setErrors({ file: 'Choose a file to add.' });
    if (file.size > EVIDENCE_MAX_BYTES) return setErrors({ file: `This file is ${(file.size / 1048576).toFixed(1)} MB; the limit is 40 MB.` });
    void send(data, {}, 'file', () => fileForm.current?.reset());
  }
  function onNote(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = e.currentTarget;
    const note = String(new FormData(form).get('note') ?? '');
    void send(JSON.stringify({ kind: 'note', note }), { 'content-type': 'application/json' }, 'note', () => form.reset());
  }

  return (
    <div className="space-y-3 rounded-lg bg-paper-deep p-4">
      <h3>Add evidence</h3>
      <p className="text-sm text-ink-soft">Evidence is kept as it was added, with its SHA-256: it cannot be replaced or deleted.</p>
      <form ref={fileForm} onSubmit={onFile} noValidate aria-label="Add a file">
        <fieldset disabled={isBusy} className="grid gap-3 sm:grid-cols-[1fr_auto] sm:items-end">
          <div>
            <label htmlFor="evidence-file" className="field-label">Photo, PDF or video</label>
            <input id="evidence-file" name="file" type="file" accept="image/*,application/pdf,video/mp4,video/quicktime" className="field-input"
              aria-invalid={errors.file ? true : undefined} aria-describedby={errors.file ? 'evidence-file-error' : undefined} />
            {errors.file && <p id="evidence-file-error" className="field-error" data-field-error="file">{errors.file}</p>}
          </div>
          <button type="submit" className="btn-primary">Add the file</button>
        </fieldset>
      </form>
      <form onSubmit={onNote} noValidate aria-label="Add a note">
        <fieldset disabled={isBusy} className="space-y-2">
          <label htmlFor="evidence-note" className="field-label">Note or witness statement</label>
          <textarea id="evidence-note" name="note" rows={3} className="field-input" aria-invalid={errors.note ? true : undefined} aria-describedby={errors.note ? 'evidence-note-error' : undefined} />
          {errors.note && <p id="evidence-note-error" className="field-error" data-field-error="note">{errors.note}</p>}
          <button type="submit" className="btn-secondary">Add the note</button>
        </fieldset>
      </form>
      <p aria-live="polite" className="font-bold" data-testid="evidence-message">{message}</p>
    </div>
  );
}
