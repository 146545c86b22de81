'use client';

import { useRouter } from 'next/navigation';
import { BOAT_DOCUMENT_MAX_BYTES, DOCUMENT_KINDS } from '@/lib/core/inputs/boats';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

/** Upload one document; a too-large (413) or wrong-type (415) file gets its reason beside the file field. */
export function DocumentUploadForm({ boatId }: { boatId: string }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const file = data.get('file');
      if (!(file instanceof File) || file.size === 0)
        return { ok: false, fieldErrors: { file: 'Choose a file to upload.' } };
      // Said here before sending 10 MB over a dock's mobile signal; the server checks again.
      if (file.size > BOAT_DOCUMENT_MAX_BYTES)
        return {
          ok: false,
          fieldErrors: { file: `This file is ${(file.size / 1024 / 1024).toFixed(1)} MB; the limit is 10 MB.` },
        };
      const answer = await requestJson<{ fileName: string }>(`/api/boats/${boatId}/documents`, {
        body: data,
        fallbackMessage: 'The upload failed. Try again.',
      });
      if (!answer.ok) {
        // The file's own refusals (too large, wrong type, unreadable) belong beside the file field.
        if (answer.status === 413 || answer.status === 415 || answer.status === 400)
          return { ok: false, fieldErrors: { file: answer.message } };
        return { ok: false, message: answer.message };
      }
      router.refresh();
      return { ok: true, message: `Uploaded ${answer.data.fileName}.` };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const fileError = state.fieldErrors?.file;

  return (
    <form {...form} className="rounded-lg bg-paper-deep p-4" aria-label="Upload a document">
      <fieldset disabled={isPending} className="grid gap-3 sm:grid-cols-[1fr_14rem_auto] sm:items-end">
        <div>
          <label htmlFor="document-file" className="field-label">
            File
          </label>
          <input
            id="document-file"
            name="file"
            type="file"
            accept="application/pdf,image/png,image/jpeg,image/webp"
            aria-invalid={fileError ? true : undefined}
            aria-describedby={fileError ? 'document-file-error' : undefined}
            className="field-input"
          />
          <FieldError id="document-file-error" name="file" error={fileError} />
        </div>
        <div>
          <label htmlFor="document-kind" className="field-label">
            Kind
          </label>
          <select id="document-kind" name="kind" defaultValue="dyno_sheet" className="field-input">
            {Object.entries(DOCUMENT_KINDS).map(([v, label]) => (
              <option key={v} value={v}>
                {label}
              </option>
            ))}
          </select>
        </div>
        <FormMessage state={state} testId="upload-message" className="sm:col-span-3" />
        <button type="submit" className="btn-primary">
          {isPending ? 'Uploading…' : 'Upload'}
        </button>
      </fieldset>
    </form>
  );
}
