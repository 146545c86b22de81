'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { FormMessage } from '@/components/forms/form-message';
import { requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

/** Withdraw an unpaid entry, after a one-step confirmation (its race number is not given back). */
export function WithdrawEntryButton({ entryId }: { entryId: string }) {
  const router = useRouter();
  const [isAsking, setAsking] = useState(false);
  const { state, isPending, form } = useFormAction(async (): Promise<FormState> => {
    const answer = await requestJson(`/api/entries/${entryId}/withdraw`, {
      fallbackMessage: 'The entry could not be withdrawn. Try again.',
    });
    if (!answer.ok) return { ok: false, message: answer.message };
    setAsking(false);
    router.refresh();
    return { ok: true };
  }, null);

  if (!isAsking)
    return (
      <button type="button" className="btn-secondary" onClick={() => setAsking(true)}>
        Withdraw
      </button>
    );
  return (
    <div role="alertdialog" aria-label="Withdraw this entry?" className="w-full space-y-2 rounded-lg bg-paper-deep p-3">
      <p>Withdraw this entry? You can enter again while entries are open, with a new race number.</p>
      <FormMessage state={state} testId="withdraw-message" />
      <form {...form} className="flex flex-wrap gap-2">
        <button type="submit" className="btn-danger" disabled={isPending}>
          {isPending ? 'Withdrawing…' : 'Yes, withdraw'}
        </button>
        <button type="button" className="btn-secondary" onClick={() => setAsking(false)} disabled={isPending}>
          Keep the entry
        </button>
      </form>
    </div>
  );
}
