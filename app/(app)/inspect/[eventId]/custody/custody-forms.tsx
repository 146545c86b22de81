'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { numberOrNull } from '@/lib/core/inputs/form-values';

/** At the dock: which boat, what part, the seal or bag number, and (for stewards) the protest it is kept for. */
export function TakeIntoCustodyForm({
  eventId,
  protests,
}: {
  eventId: string;
  protests: { id: string; label: string }[];
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const answer = await requestJson(`/api/events/${eventId}/custody`, {
        body: {
          raceNumber: numberOrNull(f.get('raceNumber')) ?? NaN,
          description: f.get('description'),
          sealNumber: f.get('sealNumber') || null,
          ...(protests.length ? { protestId: f.get('protestId') || null } : {}),
        },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Taken into custody.' };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const fieldErrors = state.fieldErrors ?? {};
  return (
    <form {...form} className="card space-y-3" aria-labelledby="take-heading">
      <h2 id="take-heading" className="text-xl">
        Take a part into custody
      </h2>
      <TextField name="raceNumber" label="Race number" inputMode="numeric" error={fieldErrors.raceNumber} />
      <TextField
        name="description"
        label="Part"
        hint="For example: impeller, nozzle insert, cracked ride plate."
        error={fieldErrors.description}
      />
      <TextField
        name="sealNumber"
        label="Seal or bag number"
        hint="Leave empty if the part is not bagged."
        error={fieldErrors.sealNumber}
      />
      {protests.length > 0 && (
        <div>
          <label htmlFor="protestId" className="field-label">
            Kept for a protest
          </label>
          <select id="protestId" name="protestId" className="field-input min-h-touch" defaultValue="">
            <option value="">No protest</option>
            {protests.map((p) => (
              <option key={p.id} value={p.id}>
                {p.label}
              </option>
            ))}
          </select>
          <FieldError name="protestId" error={fieldErrors.protestId} />
        </div>
      )}
      <FormMessage state={state} />
      <button type="submit" className="btn-primary text-lg" disabled={isPending}>
        {isPending ? 'Saving…' : 'Take into custody'}
      </button>
    </form>
  );
}

/** Hand a part back: to whom, and why; refused by the server while its protest is open. */
export function ReleaseForm({
  eventId,
  itemId,
  pendingProtest,
}: {
  eventId: string;
  itemId: string;
  pendingProtest: boolean;
}) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const answer = await requestJson(`/api/events/${eventId}/custody/${itemId}/release`, {
        body: { releasedTo: f.get('releasedTo'), note: f.get('note') ?? '' },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true };
    },
    { ok: false },
  );
  if (!open)
    return (
      <button type="button" className="btn-secondary min-h-touch text-base" onClick={() => setOpen(true)}>
        Release…
      </button>
    );
  return (
    <form {...form} className="space-y-2 pt-2">
      {pendingProtest && (
        <p className="text-base text-doubt-800">
          Its protest is not decided yet: the part stays in custody until it is.
        </p>
      )}
      <TextField
        id={`releasedTo-${itemId}`}
        name="releasedTo"
        label="Released to"
        hint="Who receives it: the entrant, a named crew member."
        error={state.fieldErrors?.releasedTo}
      />
      <TextField id={`note-${itemId}`} name="note" label="Note" error={state.fieldErrors?.note} />
      <FormMessage state={state} />
      <button type="submit" className="btn-primary text-base" disabled={isPending}>
        {isPending ? 'Releasing…' : 'Release the part'}
      </button>
    </form>
  );
}
