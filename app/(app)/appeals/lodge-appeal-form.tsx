'use client';

import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

type Choice = { id: string; eventId: string; label: string; deadlineLabel: string; fee: string | null };

/** Notice of appeal against one of the person's appealable penalties; with a fee, the appeal page opens to pay it. */
export function LodgeAppealForm({ penalties }: { penalties: Choice[] }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const chosen = penalties.find((p) => p.id === data.get('penaltyId'));
      if (!chosen)
        return {
          ok: false,
          message: 'Choose the penalty you appeal.',
          fieldErrors: { penaltyId: 'Choose the penalty you appeal.' },
        };
      const answer = await requestJson<{ id: string }>(`/api/events/${chosen.eventId}/appeals`, {
        body: { penaltyId: chosen.id, grounds: String(data.get('grounds') ?? '') },
      });
      if (!answer.ok) return refusalState(answer);
      router.push(`/appeals/${answer.data.id}`);
      return { ok: true, message: 'Notice of appeal saved.' };
    },
    { ok: false },
  );
  const errors = state.fieldErrors ?? {};
  return (
    <form {...form} className="card space-y-3" aria-label="Give notice of appeal">
      <h2>Give notice of appeal</h2>
      <fieldset disabled={isPending} className="space-y-3">
        <div>
          <label htmlFor="appeal-penalty" className="field-label">
            Penalty
          </label>
          <select
            id="appeal-penalty"
            name="penaltyId"
            className="field-input"
            aria-invalid={errors.penaltyId ? true : undefined}
            aria-describedby={errors.penaltyId ? 'appeal-penalty-error' : undefined}
          >
            {penalties.map((p) => (
              <option key={p.id} value={p.id}>
                {`${p.label} — notice due by ${p.deadlineLabel}${p.fee ? `, fee ${p.fee}` : ''}`}
              </option>
            ))}
          </select>
          <FieldError id="appeal-penalty-error" name="penaltyId" error={errors.penaltyId} />
        </div>
        <div>
          <label htmlFor="appeal-grounds" className="field-label">
            Grounds
          </label>
          <textarea
            id="appeal-grounds"
            name="grounds"
            rows={4}
            className="field-input"
            aria-invalid={errors.grounds ? true : undefined}
            aria-describedby={errors.grounds ? 'appeal-grounds-error' : undefined}
          />
          <FieldError id="appeal-grounds-error" name="grounds" error={errors.grounds} />
        </div>
        <FormMessage state={state} />
        <button type="submit" className="btn-primary">
          Give notice of appeal
        </button>
      </fieldset>
    </form>
  );
}
