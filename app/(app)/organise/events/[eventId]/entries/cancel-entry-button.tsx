'use client';

import { useRouter } from 'next/navigation';
import { requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import type { EventEntryRow } from '@/lib/server/entries/list-event-entries';

export function CancelEntryButton({ eventId, entry }: { eventId: string; entry: EventEntryRow }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (prev: FormState): Promise<FormState> => {
      const reason = window.prompt(
        `Cancel entry #${entry.raceNumber} (${entry.boatName})? ${entry.paidAt ? 'The fee will be refunded. ' : ''}Reason for the entrant:`,
      );
      if (!reason) return prev;
      const answer = await requestJson(`/api/events/${eventId}/entries/${entry.id}/cancel`, { body: { reason } });
      if (!answer.ok) return { ok: false, message: answer.fieldErrors.reason ?? answer.message };
      router.refresh();
      return { ok: true };
    },
    { ok: false },
  );
  if (entry.status === 'cancelled' || entry.status === 'withdrawn') return null;
  // The reason is asked in a prompt, so a refusal of it is said here, above the button.
  return (
    <form {...form} className="inline">
      {!state.ok && state.message && (
        <span role="status" className="field-error block text-sm">
          {state.message}
        </span>
      )}
      <button type="submit" className="btn-danger min-h-touch px-3 text-sm" disabled={isPending}>
        Cancel
      </button>
    </form>
  );
}
