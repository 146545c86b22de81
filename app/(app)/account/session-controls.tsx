'use client';

import { useActionState, useEffect } from 'react';
import { signOut } from 'next-auth/react';
import { resendAddressProofAction, signOutEverywhereAction } from './actions';

export function SignOutEverywhereForm() {
  const [state, action, isPending] = useActionState(signOutEverywhereAction, null);
  useEffect(() => {
    if (state?.ok) void signOut({ callbackUrl: '/sign-in' });
  }, [state]);
  return (
    <form action={action} className="space-y-2">
      <input type="hidden" name="confirm" value="everywhere" />
      <button type="submit" className="btn-secondary" disabled={isPending}>{isPending ? 'Signing out…' : 'Sign out everywhere'}</button>
      <p aria-live="polite" className={state?.ok ? 'font-bold text-pass-600' : 'field-error'}>{state?.message}</p>
    </form>
  );
}

export function ResendProofForm() {
  const [state, action, isPending] = useActionState(resendAddressProofAction, null);
  return (
    <form action={action} className="space-y-2">
      <input type="hidden" name="confirm" value="send" />
      <button type="submit" className="btn-secondary" disabled={isPending}>{isPending ? 'Sending…' : 'Send the link again'}</button>
      <p aria-live="polite" data-testid="resend-result" className={state?.ok ? 'font-bold text-pass-600' : 'field-error'}>{state?.message}</p>
    </form>
  );
}
