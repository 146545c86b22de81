'use client';

import { useRouter } from 'next/navigation';
import { FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import type { PersonView } from '@/lib/server/admin/person-view';

/**
 * Appoints one person to the governing body's appeal body, or ends the appointment, in their row. The appeal
 * body hears appeals against stewards' decisions at every meeting, so the button says so; a person who has not
 * proven their address is refused with the reason beside the button.
 */
export function AppealBodyControl({ person }: { person: PersonView }) {
  const router = useRouter();
  const toggle = useFormAction(
    async (): Promise<FormState> => {
      const answer = await requestJson(`/api/admin/people/${person.id}/appeal-body`, {
        method: person.isAppealBody ? 'DELETE' : 'PUT',
        body: {},
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true };
    },
    { ok: false },
  );
  if (person.suspendedAt && !person.isAppealBody) return null;
  return (
    <form {...toggle.form} className="space-y-1">
      <FormMessage state={toggle.state} />
      <button type="submit" className="btn-secondary min-h-touch px-3 text-sm" disabled={toggle.isPending}>
        {toggle.isPending
          ? 'Saving…'
          : person.isAppealBody
            ? 'End appeal body appointment'
            : 'Appoint to the appeal body'}
      </button>
    </form>
  );
}
