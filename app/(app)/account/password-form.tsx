'use client';

import { useEffect, useRef } from 'react';
import { useRouter } from 'next/navigation';
import { signInWith } from '@/components/sign-in';
import { changePasswordAction, type ActionResult } from './actions';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/forms/form-message';
import { useFormAction } from '@/components/forms/use-form-action';

// A password change ends every session, this one included: the form signs the person straight back
// in with the new password, so only the other devices notice.
export function PasswordForm({ email, hasPassword }: { email: string; hasPassword: boolean }) {
  const router = useRouter();
  const newPassword = useRef('');
  const { state, isPending, form } = useFormAction(
    async (prev: ActionResult | null, data: FormData) => {
      newPassword.current = String(data.get('password') ?? '');
      return changePasswordAction(prev, data);
    },
    null,
    { resetOnSuccess: true },
  );
  useEffect(() => {
    if (!state?.ok) return;
    void signInWith('password', { email, password: newPassword.current })
      .catch(() => null)
      .then(() => router.refresh());
    newPassword.current = '';
  }, [state, email, router]);
  return (
    <form {...form}>
      <fieldset disabled={isPending} className="space-y-3">
        {hasPassword && (
          <TextField
            name="currentPassword"
            label="Current password"
            type="password"
            autoComplete="current-password"
            error={state?.fieldErrors?.currentPassword}
          />
        )}
        <TextField
          name="password"
          label="New password"
          type="password"
          autoComplete="new-password"
          hint="At least 10 characters."
          error={state?.fieldErrors?.password}
        />
        <FormMessage state={state} testId="password-result" />
        <button type="submit" className="btn-primary">
          {isPending ? 'Saving…' : 'Save password'}
        </button>
      </fieldset>
    </form>
  );
}
