'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { InviteStaffInput } from '@/lib/core/inputs/auth';
import { fieldErrors } from '@/lib/core/errors';
import { EVENT_STAFF_ROLES } from '@/lib/core/constants';
import { TextField } from '@/components/ui/text-field';

const ROLE_LABEL: Record<string, string> = {
  organiser: 'Organiser',
  chief_scrutineer: 'Chief scrutineer',
  scrutineer: 'Scrutineer',
  steward: 'Steward',
};

export function InviteStaffForm({ eventId }: { eventId: string }) {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string>();
  const [isBusy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const formEl = e.currentTarget;
    const parsed = InviteStaffInput.safeParse(Object.fromEntries(new FormData(formEl)));
    setMessage(undefined);
    if (!parsed.success) return setErrors(fieldErrors(parsed.error));
    setBusy(true);
    setErrors({});
    const res = await fetch(`/api/events/${eventId}/staff`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(parsed.data),
    });
    const body = await res.json().catch(() => null);
    setBusy(false);
    if (!res.ok) {
      const next: Record<string, string> = {};
      for (const d of body?.error?.details ?? []) next[d.field] ??= d.message;
      setErrors(next);
      setMessage(body?.error?.message ?? 'The invitation could not be sent.');
      return;
    }
    formEl.reset();
    setMessage(
      body.data.outcome === 'assigned'
        ? `${parsed.data.email} already has an account and now has the role (they were told by e-mail).`
        : `Invitation sent to ${parsed.data.email}: the role is given only when the link in it is followed from that mailbox.`,
    );
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} noValidate className="rounded-lg bg-paper-deep p-4">
      <fieldset disabled={isBusy} className="grid gap-3 sm:grid-cols-[1fr_12rem_auto] sm:items-end">
        <legend className="mb-2 font-bold">Add staff: a person whose address is confirmed gets the role at once, anyone else an e-mailed invitation</legend>
        <TextField id={`invite-email-${eventId}`} name="email" label="E-mail" type="email" error={errors.email} />
        <div>
          <label htmlFor={`invite-role-${eventId}`} className="field-label">Role</label>
          <select id={`invite-role-${eventId}`} name="role" className="field-input" defaultValue="scrutineer">
            {EVENT_STAFF_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABEL[r]}</option>)}
          </select>
          {errors.role && <p className="field-error">{errors.role}</p>}
        </div>
        <button type="submit" className="btn-primary">{isBusy ? 'Sending…' : 'Send invitation'}</button>
      </fieldset>
      <p aria-live="polite" className="mt-2 font-bold">{message}</p>
    </form>
  );
}
