'use client';

import { useState } from 'react';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';

export function ConfirmAddressForm({ token }: { token: string }) {
  const router = useRouter();
  const [isBusy, setBusy] = useState(false);
  const [error, setError] = useState<string>();
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const password = String(new FormData(e.currentTarget).get('password') ?? '');
    if (!password) return setError('Enter the password you chose at sign-up.');
    setBusy(true);
    setError(undefined);
    const res = await signIn('address-proof', { token, password, redirect: false }).catch(() => null);
    setBusy(false);
    if (!res || res.error) return setError('That did not work: check the password, or the link may have expired (My account sends a new one).');
    router.push('/account?confirmed=1');
    router.refresh();
  }
  return (
    <form onSubmit={onSubmit} noValidate>
      <fieldset disabled={isBusy} className="space-y-3">
        <TextField name="password" label="Your password" type="password" autoComplete="current-password" error={error} />
        <button type="submit" className="btn-primary w-full">{isBusy ? 'Confirming…' : 'Confirm and sign in'}</button>
      </fieldset>
    </form>
  );
}
