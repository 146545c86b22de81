'use client';

import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { numberOrNull } from '@/lib/core/inputs/form-values';

/** The chief scrutineer opens a slot: class, bay, start (the meeting's local time), length, capacity, grace. */
export function OpenSlotForm({
  eventId,
  timeZone,
  classes,
}: {
  eventId: string;
  timeZone: string;
  classes: { id: string; code: string; name: string }[];
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const answer = await requestJson(`/api/events/${eventId}/slots`, {
        body: {
          classId: f.get('classId'),
          bay: f.get('bay'),
          startsAt: f.get('startsAt'),
          durationMinutes: numberOrNull(f.get('durationMinutes')) ?? NaN,
          capacity: numberOrNull(f.get('capacity')) ?? NaN,
          graceMinutes: numberOrNull(f.get('graceMinutes')) ?? NaN,
        },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Slot opened.' };
    },
    { ok: false },
  );
  const fe = state.fieldErrors ?? {};
  return (
    <form {...form} className="card space-y-3" aria-labelledby="open-slot-heading">
      <h2 id="open-slot-heading" className="text-xl">
        Open a slot
      </h2>
      <div>
        <label htmlFor="classId" className="field-label">
          Class
        </label>
        <select id="classId" name="classId" className="field-input min-h-touch">
          {classes.map((c) => (
            <option key={c.id} value={c.id}>
              {c.code} · {c.name}
            </option>
          ))}
        </select>
        <FieldError name="classId" error={fe.classId} />
      </div>
      <TextField name="bay" label="Bay" hint="For example: Bay 1, the weighbridge." error={fe.bay} />
      <TextField
        name="startsAt"
        type="datetime-local"
        label={`Starts (${timeZone})`}
        hint="The meeting's local time, on one of its days."
        error={fe.startsAt}
      />
      <TextField
        name="durationMinutes"
        label="Length (minutes)"
        inputMode="numeric"
        defaultValue="20"
        error={fe.durationMinutes}
      />
      <TextField name="capacity" label="Boats it takes" inputMode="numeric" defaultValue="3" error={fe.capacity} />
      <TextField
        name="graceMinutes"
        label="Grace period (minutes)"
        hint="A boat not checked in this long after the start shows as late."
        inputMode="numeric"
        defaultValue="10"
        error={fe.graceMinutes}
      />
      <FormMessage state={state} />
      <button type="submit" className="btn-primary text-lg" disabled={isPending}>
        {isPending ? 'Opening…' : 'Open the slot'}
      </button>
    </form>
  );
}

/** The chief scrutineer gives an entry a slot (or moves it). */
export function AssignSlotForm({
  eventId,
  entries,
  slots,
}: {
  eventId: string;
  entries: { id: string; label: string }[];
  slots: { id: string; label: string }[];
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const entryId = String(f.get('entryId') ?? '');
      const answer = await requestJson(`/api/events/${eventId}/slots/entries/${encodeURIComponent(entryId)}`, {
        body: { slotId: f.get('slotId') },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Slot given.' };
    },
    { ok: false },
  );
  const fe = state.fieldErrors ?? {};
  return (
    <form {...form} className="card space-y-3" aria-labelledby="assign-slot-heading">
      <h2 id="assign-slot-heading" className="text-xl">
        Give an entry a slot
      </h2>
      <div>
        <label htmlFor="entryId" className="field-label">
          Entry
        </label>
        <select id="entryId" name="entryId" className="field-input min-h-touch">
          {entries.map((e) => (
            <option key={e.id} value={e.id}>
              {e.label}
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="slotId" className="field-label">
          Slot
        </label>
        <select id="slotId" name="slotId" className="field-input min-h-touch">
          {slots.map((s) => (
            <option key={s.id} value={s.id}>
              {s.label}
            </option>
          ))}
        </select>
        <FieldError name="slotId" error={fe.slotId} />
      </div>
      <FormMessage state={state} />
      <button type="submit" className="btn-primary text-lg" disabled={isPending}>
        {isPending ? 'Saving…' : 'Give the slot'}
      </button>
    </form>
  );
}
