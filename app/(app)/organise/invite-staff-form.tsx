'use client';

import { useRouter } from 'next/navigation';
import { InviteStaffInput } from '@/lib/core/inputs/auth';
import { fieldErrors } from '@/lib/core/errors';
import { EVENT_STAFF_ROLES } from '@/lib/core/constants';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { CHECK_FIELDS_MESSAGE, refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

const ROLE_LABEL: Record<string, string> = {
  organiser: 'Organiser',
  chief_scrutineer: 'Chief scrutineer',
  scrutineer: 'Scrutineer',
  steward: 'Steward',
};

export function InviteStaffForm({ eventId }: { eventId: string }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const parsed = InviteStaffInput.safeParse(Object.fromEntries(data));
      if (!parsed.success) return { ok: false, fieldErrors: fieldErrors(parsed.error), message: CHECK_FIELDS_MESSAGE };
      const answer = await requestJson<{ outcome: string }>(`/api/events/${eventId}/staff`, {
        body: parsed.data,
        fallbackMessage: 'The invitation could not be sent.',
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return {
        ok: true,
        message:
          answer.data.outcome === 'assigned'
            ? `${parsed.data.email} already has an account and now has the role (they were told by e-mail).`
            : `Invitation sent to ${parsed.data.email}: the role is given only when the link in it is followed from that mailbox.`,
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
          Add staff: a person whose address is confirmed gets the role at once, anyone else an e-mailed invitation
        </legend>
        <TextField id={`invite-email-${eventId}`} name="email" label="E-mail" type="email" error={errors.email} />
        <div>
          <label htmlFor={`invite-role-${eventId}`} className="field-label">
            Role
          </label>
          <select id={`invite-role-${eventId}`} name="role" className="field-input" defaultValue="scrutineer">
            {EVENT_STAFF_ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABEL[r]}
              </option>
            ))}
          </select>
          <FieldError name="role" error={errors.role} />
        </div>
        <FormMessage state={state} testId="invite-message" className="sm:col-span-3" />
        <button type="submit" className="btn-primary justify-self-start">
          {isPending ? 'Sending…' : 'Send invitation'}
        </button>
      </fieldset>
    </form>
  );
}
