'use client';

import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

/** Book the entry into a slot, or move its booking to another. */
export function BookSlotForm({
  eventId,
  entryId,
  slots,
  hasBooking,
}: {
  eventId: string;
  entryId: string;
  slots: { id: string; label: string; full: boolean }[];
  hasBooking: boolean;
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const answer = await requestJson(`/api/events/${eventId}/slots/entries/${entryId}`, {
        body: { slotId: f.get('slotId') },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Booked. A reminder is e-mailed an hour before the slot.' };
    },
    { ok: false },
  );
  const fe = state.fieldErrors ?? {};
  return (
    <form {...form} className="card space-y-3" aria-labelledby="book-heading">
      <h2 id="book-heading" className="text-xl">
        {hasBooking ? 'Move to another slot' : 'Book a slot'}
      </h2>
      <fieldset className="space-y-2" aria-describedby={fe.slotId ? 'slotId-error' : undefined}>
        <legend className="field-label">Slot</legend>
        {slots.map((s) => (
          <label key={s.id} className="flex min-h-touch items-center gap-2">
            <input type="radio" name="slotId" value={s.id} disabled={s.full} />
            <span>
              {s.label}
              {s.full ? ' (full)' : ''}
            </span>
          </label>
        ))}
      </fieldset>
      <FieldError name="slotId" error={fe.slotId} />
      <FormMessage state={state} />
      <button type="submit" className="btn-primary text-lg" disabled={isPending}>
        {isPending ? 'Booking…' : hasBooking ? 'Move the booking' : 'Book'}
      </button>
    </form>
  );
}
