'use client';

import { useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { BOAT_DOCUMENT_MAX_BYTES, DOCUMENT_KINDS } from '@/lib/core/inputs/boats';

/** Upload one document; a too-large (413) or wrong-type (415) file gets its reason beside the file field. */
export function DocumentUploadForm({ boatId }: { boatId: string }) {
  const router = useRouter();
  const formRef = useRef<HTMLFormElement>(null);
  const [fileError, setFileError] = useState<string>();
  const [message, setMessage] = useState<string>();
  const [isBusy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setMessage(undefined);
    setFileError(undefined);
    const data = new FormData(e.currentTarget);
    const file = data.get('file');
    if (!(file instanceof File) || file.size === 0) return setFileError('Choose a file to upload.');
    // Said here before sending 10 MB over a dock's mobile signal; the server checks again.
    if (file.size > BOAT_DOCUMENT_MAX_BYTES) return setFileError(`This file is ${(file.size / 1024 / 1024).toFixed(1)} MB; the limit is 10 MB.`);
    setBusy(true);
    const res = await fetch(`/api/boats/${boatId}/documents`, { method: 'POST', body: data });
    const json = await res.json().catch(() => null);
    setBusy(false);
    if (!res.ok) {
      const text = json?.error?.message ?? 'The upload failed. Try again.';
      if (res.status === 413 || res.status === 415 || res.status === 400) setFileError(text);
      else setMessage(text);
      return;
    }
    formRef.current?.reset();
    setMessage(`Uploaded ${json.data.fileName}.`);
    router.refresh();
  }

  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="rounded-lg bg-paper-deep p-4" aria-label="Upload a document">
      <fieldset disabled={isBusy} className="grid gap-3 sm:grid-cols-[1fr_14rem_auto] sm:items-end">
        <div>
          <label htmlFor="document-file" className="field-label">File</label>
          <input id="document-file" name="file" type="file" accept="application/pdf,image/png,image/jpeg,image/webp"
            aria-invalid={fileError ? true : undefined} aria-describedby={fileError ? 'document-file-error' : undefined} className="field-input" />
          {fileError && <p id="document-file-error" className="field-error" data-field-error="file">{fileError}</p>}
        </div>
        <div>
          <label htmlFor="document-kind" className="field-label">Kind</label>
          <select id="document-kind" name="kind" defaultValue="dyno_sheet" className="field-input">
            {Object.entries(DOCUMENT_KINDS).map(([v, label]) => <option key={v} value={v}>{label}</option>)}
          </select>
        </div>
        <button type="submit" className="btn-primary">{isBusy ? 'Uploading…' : 'Upload'}</button>
      </fieldset>
      <p aria-live="polite" className="mt-2 font-bold" data-testid="upload-message">{message}</p>
    </form>
  );
}
