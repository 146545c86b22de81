'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import type { PersonView } from '@/lib/server/admin/person-view';

/** Suspend (with a reason the other administrators read) or reinstate one account, in its row. */
export function SuspensionControl({ person, isSelf }: { person: PersonView; isSelf: boolean }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const url = `/api/admin/people/${person.id}/suspension`;
  const lift = useFormAction(
    async (): Promise<FormState> => {
      const answer = await requestJson(url, { method: 'DELETE', body: {} });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true };
    },
    { ok: false },
  );
  const suspend = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const answer = await requestJson(url, { method: 'PUT', body: { reason: String(data.get('reason') ?? '') } });
      if (!answer.ok) return refusalState(answer);
      setOpen(false);
      router.refresh();
      return { ok: true };
    },
    { ok: false },
  );

  if (isSelf) return <span className="text-sm text-ink-mute">your account</span>;
  if (person.suspendedAt) {
    return (
      <form {...lift.form} className="space-y-1">
        <FormMessage state={lift.state} />
        <button type="submit" className="btn-secondary min-h-touch px-3 text-sm" disabled={lift.isPending}>
          {lift.isPending ? 'Lifting…' : 'Lift suspension'}
        </button>
      </form>
    );
  }
  if (!open)
    return (
      <button type="button" className="btn-secondary min-h-touch px-3 text-sm" onClick={() => setOpen(true)}>
        Suspend…
      </button>
    );
  const reasonError = suspend.state.fieldErrors?.reason;
  return (
    <form {...suspend.form} className="space-y-2">
      <label htmlFor={`reason-${person.id}`} className="field-label">
        Why is {person.name ?? person.email} suspended?
      </label>
      <textarea
        id={`reason-${person.id}`}
        name="reason"
        rows={2}
        className="field-input"
        aria-invalid={Boolean(reasonError)}
        aria-describedby={`reason-${person.id}-error`}
      />
      <FieldError id={`reason-${person.id}-error`} name="reason" error={reasonError} />
      <p className="text-sm text-ink-soft">
        They cannot sign in, and any session they have open stops working at once. Their boats, entries and records
        stay.
      </p>
      <FormMessage state={suspend.state} />
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-danger min-h-touch px-3 text-sm" disabled={suspend.isPending}>
          {suspend.isPending ? 'Suspending…' : 'Suspend the account'}
        </button>
        <button type="button" className="btn-secondary min-h-touch px-3 text-sm" onClick={() => setOpen(false)}>
          Keep it
        </button>
      </div>
    </form>
  );
}
