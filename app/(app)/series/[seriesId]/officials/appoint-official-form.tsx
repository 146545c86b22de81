'use client';

import { useRouter } from 'next/navigation';
import { AppointSeriesOfficialInput, SERIES_OFFICIAL_ROLES } from '@/lib/core/inputs/series';
import { fieldErrors } from '@/lib/core/errors';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { CHECK_FIELDS_MESSAGE, refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { SERIES_ROLE_LABEL } from './role-labels';

// Every appointment is an invitation to the address: the answer is the same whether or not it has an account.
export function AppointOfficialForm({ seriesId }: { seriesId: string }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const parsed = AppointSeriesOfficialInput.safeParse(Object.fromEntries(data));
      if (!parsed.success) return { ok: false, fieldErrors: fieldErrors(parsed.error), message: CHECK_FIELDS_MESSAGE };
      const answer = await requestJson(`/api/series/${seriesId}/officials`, {
        body: parsed.data,
        fallbackMessage: 'The invitation could not be sent.',
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return {
        ok: true,
        message: `Invitation sent to ${parsed.data.email}. They hold the role once they accept it from that mailbox.`,
      };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const errors = state.fieldErrors ?? {};

  return (
    <form {...form} className="rounded-lg bg-paper-deep p-4">
      <fieldset disabled={isPending} className="grid gap-3 sm:grid-cols-[1fr_12rem_auto] sm:items-end">
        <legend className="mb-2 font-bold">
          Invite an official: the person holds the role once they accept the e-mailed invitation
        </legend>
        <TextField id="official-email" name="email" label="E-mail" type="email" error={errors.email} />
        <div>
          <label htmlFor="official-role" className="field-label">
            Role
          </label>
          <select id="official-role" name="role" className="field-input" defaultValue="series_steward">
            {SERIES_OFFICIAL_ROLES.map((r) => (
              <option key={r} value={r}>
                {SERIES_ROLE_LABEL[r]}
              </option>
            ))}
          </select>
          <FieldError name="role" error={errors.role} />
        </div>
        <FormMessage state={state} testId="official-invite-message" className="sm:col-span-3" />
        <button type="submit" className="btn-primary justify-self-start">
          {isPending ? 'Sending…' : 'Send invitation'}
        </button>
      </fieldset>
    </form>
  );
}
