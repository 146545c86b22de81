'use client';

import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

/** Withdraws one of the official's own declarations with a reason; the declaration stays in the register. */
export function WithdrawInterestForm({ eventId, interestId }: { eventId: string; interestId: string }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const answer = await requestJson(`/api/events/${eventId}/interests/${interestId}/withdraw`, {
        body: { reason: String(data.get('reason') ?? '') },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true };
    },
    { ok: false },
  );
  const id = `withdraw-${interestId}`;
  const reasonError = state.fieldErrors?.reason;
  return (
    <details className="mt-2">
      <summary className="cursor-pointer text-tide-700">Withdraw</summary>
      <form {...form} className="mt-2 space-y-2" aria-label="Withdraw this declaration">
        <fieldset disabled={isPending} className="space-y-2">
          <label htmlFor={id} className="field-label">
            Why it no longer applies
          </label>
          <input
            id={id}
            name="reason"
            className="field-input"
            aria-invalid={reasonError ? true : undefined}
            aria-describedby={reasonError ? `${id}-error` : undefined}
          />
          <FieldError id={`${id}-error`} name="reason" error={reasonError} />
          <FormMessage state={state} />
          <button type="submit" className="btn-secondary">
            Withdraw the declaration
          </button>
        </fieldset>
      </form>
    </details>
  );
}
