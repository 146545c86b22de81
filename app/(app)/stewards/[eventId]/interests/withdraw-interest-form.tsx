'use client';

import { useRouter } from 'next/navigation';
import { useJsonSubmit, FormMessage } from '@/components/ui/use-json-submit';

/** Withdraws one of the official's own declarations with a reason; the declaration stays in the register. */
export function WithdrawInterestForm({ eventId, interestId }: { eventId: string; interestId: string }) {
  const router = useRouter();
  const { submit, isBusy, fieldErrors, message } = useJsonSubmit();
  const id = `withdraw-${interestId}`;
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const res = await submit(`/api/events/${eventId}/interests/${interestId}/withdraw`, { reason: String(new FormData(e.currentTarget).get('reason') ?? '') });
    if (res.ok) router.refresh();
  }
  return (
    <details className="mt-2">
      <summary className="cursor-pointer text-tide-700">Withdraw</summary>
      <form onSubmit={onSubmit} noValidate className="mt-2 space-y-2" aria-label="Withdraw this declaration">
        <fieldset disabled={isBusy} className="space-y-2">
          <label htmlFor={id} className="field-label">Why it no longer applies</label>
          <input id={id} name="reason" className="field-input" aria-invalid={fieldErrors.reason ? true : undefined} aria-describedby={fieldErrors.reason ? `${id}-error` : undefined} />
          {fieldErrors.reason && <p id={`${id}-error`} className="field-error" data-field-error="reason">{fieldErrors.reason}</p>}
          <button type="submit" className="btn-secondary">Withdraw the declaration</button>
        </fieldset>
        <FormMessage message={message} />
      </form>
    </details>
  );
}
