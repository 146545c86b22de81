'use client';

import { useActionState, useEffect, useRef } from 'react';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { changePasswordAction } from './actions';
import { TextField } from '@/components/ui/text-field';

// A password change ends every session, this one included: the form signs the person straight back
// in with the new password, so only the other devices notice.
export function PasswordForm({ email, hasPassword }: { email: string; hasPassword: boolean }) {
  const router = useRouter();
  const newPassword = useRef('');
  const [state, action, isPending] = useActionState(async (prev: Awaited<ReturnType<typeof changePasswordAction>> | null, form: FormData) => {
    newPassword.current = String(form.get('password') ?? '');
    return changePasswordAction(prev, form);
  }, null);
  useEffect(() => {
    if (!state?.ok) return;
    void signIn('password', { email, password: newPassword.current, redirect: false }).then(() => router.refresh());
    newPassword.current = '';
  }, [state, email, router]);
  return (
    <form action={action}>
      <fieldset disabled={isPending} className="space-y-3">
        {hasPassword && (
          <TextField name="currentPassword" label="Current password" type="password" autoComplete="current-password" error={state?.fieldErrors?.currentPassword} />
        )}
        <TextField name="password" label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={state?.fieldErrors?.password} />
        <button type="submit" className="btn-primary">{isPending ? 'Saving…' : 'Save password'}</button>
        <p aria-live="polite" data-testid="password-result" className={state?.ok ? 'font-bold text-pass-600' : 'field-error'}>{state?.message}</p>
      </fieldset>
    </form>
  );
}
