'use client';

import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

export function PublishReportForm({
  eventId,
  classId,
  nextNumber,
  canPublish,
}: {
  eventId: string;
  classId: string;
  nextNumber: number;
  canPublish: boolean;
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const note = String(data.get('note') ?? '');
      const answer = await requestJson<{ publicId: string; number: number }>(
        `/api/events/${eventId}/classes/${classId}/report/publish`,
        { body: { note } },
      );
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return {
        ok: true,
        message: `Version ${answer.data.number} published; the class's entrants were e-mailed the link.`,
      };
    },
    { ok: false },
  );
  return (
    <form {...form} aria-busy={isPending}>
      <fieldset disabled={isPending || !canPublish} className="space-y-3">
        <label htmlFor="note" className="field-label">
          Note for readers (optional)
        </label>
        <textarea
          id="note"
          name="note"
          rows={3}
          className="field-input"
          aria-invalid={state.fieldErrors?.note ? true : undefined}
          aria-describedby={state.fieldErrors?.note ? 'note-error' : undefined}
        />
        <FieldError name="note" error={state.fieldErrors?.note} />
        {/* Publishing computes the figures, draws the PDF and e-mails the class: several seconds, so say so while it runs. */}
        <div role="status" aria-live="polite" data-testid="publish-progress">
          {isPending && (
            <div className="space-y-2 rounded-lg bg-tide-50 p-3 text-tide-700">
              <p className="font-bold">
                Publishing version {nextNumber}: computing the figures, making the PDF and e-mailing the class. This
                takes a few seconds; keep this page open.
              </p>
              <progress className="h-3 w-full" aria-label="Publishing the report">
                Publishing…
              </progress>
            </div>
          )}
        </div>
        <FormMessage state={state} />
        <button type="submit" className="btn-primary">
          {isPending ? 'Publishing…' : `Publish as version ${nextNumber}`}
        </button>
        {!canPublish && <p className="field-hint">No boat has a conforming inspection yet.</p>}
      </fieldset>
    </form>
  );
}
