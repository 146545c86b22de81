'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { FormMessage, useJsonSubmit } from '@/components/ui/use-json-submit';
import type { PersonView } from '@/lib/server/admin/person-view';

/** Suspend (with a reason the other administrators read) or reinstate one account, in its row. */
export function SuspensionControl({ person, isSelf }: { person: PersonView; isSelf: boolean }) {
  const router = useRouter();
  const { submit, isBusy, fieldErrors, message } = useJsonSubmit();
  const [open, setOpen] = useState(false);
  const url = `/api/admin/people/${person.id}/suspension`;
  if (isSelf) return <span className="text-sm text-ink-mute">your account</span>;
  if (person.suspendedAt) {
    return (
      <div className="space-y-1">
        <button type="button" className="btn-secondary min-h-touch px-3 text-sm" disabled={isBusy}
          onClick={async () => { if ((await submit(url, {}, 'DELETE')).ok) router.refresh(); }}>
          {isBusy ? 'Lifting…' : 'Lift suspension'}
        </button>
        <FormMessage message={message} />
      </div>
    );
  }
  if (!open) return <button type="button" className="btn-secondary min-h-touch px-3 text-sm" onClick={() => setOpen(true)}>Suspend…</button>;
  return (
    <form className="space-y-2" onSubmit={async (e) => {
      e.preventDefault();
      const reason = String(new FormData(e.currentTarget).get('reason') ?? '');
      if ((await submit(url, { reason }, 'PUT')).ok) { setOpen(false); router.refresh(); }
    }}>
      <label htmlFor={`reason-${person.id}`} className="field-label">Why is {person.name ?? person.email} suspended?</label>
      <textarea id={`reason-${person.id}`} name="reason" rows={2} className="field-input" aria-invalid={Boolean(fieldErrors.reason)} aria-describedby={`reason-${person.id}-error`} />
      {fieldErrors.reason && <p id={`reason-${person.id}-error`} className="field-error" data-field-error="reason">{fieldErrors.reason}</p>}
      <p className="text-sm text-ink-soft">They cannot sign in, and any session they have open stops working at once. Their boats, entries and records stay.</p>
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-danger min-h-touch px-3 text-sm" disabled={isBusy}>{isBusy ? 'Suspending…' : 'Suspend the account'}</button>
        <button type="button" className="btn-secondary min-h-touch px-3 text-sm" onClick={() => setOpen(false)}>Keep it</button>
      </div>
      <FormMessage message={message} />
    </form>
  );
}
