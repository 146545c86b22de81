'use client';

import { useEffect } from 'react';
import { signOutTo } from '@/components/sign-out';
import { resendAddressProofAction, signOutEverywhereAction } from './actions';
import { FormMessage } from '@/components/forms/form-message';
import { useFormAction } from '@/components/forms/use-form-action';

export function SignOutEverywhereForm() {
  const { state, isPending, form } = useFormAction(signOutEverywhereAction, null);
  useEffect(() => {
    if (state?.ok) void signOutTo('/sign-in');
  }, [state]);
  return (
    <form {...form} className="space-y-2">
      <input type="hidden" name="confirm" value="everywhere" />
      <FormMessage state={state} testId="sign-out-everywhere-result" />
      <button type="submit" className="btn-secondary" disabled={isPending}>
        {isPending ? 'Signing out…' : 'Sign out everywhere'}
      </button>
    </form>
  );
}

export function ResendProofForm() {
  const { state, isPending, form } = useFormAction(resendAddressProofAction, null);
  return (
    <form {...form} className="space-y-2">
      <input type="hidden" name="confirm" value="send" />
      <FormMessage state={state} testId="resend-result" />
      <button type="submit" className="btn-secondary" disabled={isPending}>
        {isPending ? 'Sending…' : 'Send the link again'}
      </button>
    </form>
  );
}
