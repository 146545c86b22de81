'use client';

import { useActionState } from 'react';
import { changePasswordAction } from './actions';
import { TextField } from '@/components/ui/text-field';

export function PasswordForm() {
  const [state, action, isPending] = useActionState(changePasswordAction, null);
  return (
    <form action={action}>
      <fieldset disabled={isPending} className="space-y-3">
        <TextField name="password" label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={state?.fieldErrors?.password} />
        <button type="submit" className="btn-primary">{isPending ? 'Saving…' : 'Save password'}</button>
        <p aria-live="polite" className={state?.ok ? 'font-bold text-pass-600' : 'field-error'}>{state?.message}</p>
      </fieldset>
    </form>
  );
}
