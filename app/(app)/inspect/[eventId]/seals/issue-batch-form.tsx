'use client';

import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { numberOrNull } from '@/lib/core/inputs/form-values';
import { SEAL_BATCH_MAX } from '@/lib/core/inputs/seals';

/** Issue a batch of numbered seals to the meeting: prefix and first..last (at most 1000), with a note. */
export function IssueBatchForm({ eventId }: { eventId: string }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const answer = await requestJson(`/api/events/${eventId}/seal-batches`, {
        body: {
          prefix: f.get('prefix') ?? '',
          firstNumber: numberOrNull(f.get('firstNumber')),
          lastNumber: numberOrNull(f.get('lastNumber')),
          note: f.get('note') ?? '',
        },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Issued: the dock accepts these numbers from now on.' };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const fieldErrors = state.fieldErrors ?? {};
  return (
    <form {...form} className="card space-y-3" aria-labelledby="issue-batch-heading">
      <h2 id="issue-batch-heading" className="text-xl">
        Issue a batch of seals
      </h2>
      <fieldset disabled={isPending} className="space-y-3">
        <TextField
          name="prefix"
          label="Prefix"
          hint="Printed before each number, letters, digits or dashes (“NV-”). May be empty."
          error={fieldErrors.prefix}
          autoComplete="off"
        />
        <div className="grid grid-cols-2 gap-3">
          <TextField name="firstNumber" label="First number" inputMode="numeric" error={fieldErrors.firstNumber} />
          <TextField
            name="lastNumber"
            label="Last number"
            inputMode="numeric"
            hint={`At most ${SEAL_BATCH_MAX} seals in one batch.`}
            error={fieldErrors.lastNumber}
          />
        </div>
        <TextField name="note" label="Note" hint="Where the seals are kept, who holds them." error={fieldErrors.note} />
        <FormMessage state={state} />
        <button type="submit" className="btn-primary">
          {isPending ? 'Issuing…' : 'Issue the batch'}
        </button>
      </fieldset>
    </form>
  );
}
