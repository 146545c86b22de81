'use client';

import { useState } from 'react';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';

export function AcceptInvitation({ token }: { token: string }) {
  const router = useRouter();
  const [isBusy, setBusy] = useState(false);
  const [error, setError] = useState<string>();
  async function accept() {
    setBusy(true);
    const res = await signIn('invitation', { token, redirect: false });
    setBusy(false);
    if (!res || res.error) return setError('The invitation could not be accepted: it may have just expired or been used.');
    router.push('/home');
    router.refresh();
  }
  return (
    <div className="space-y-3">
      <button type="button" onClick={accept} disabled={isBusy} className="btn-primary w-full">
        {isBusy ? 'Accepting…' : 'Accept and sign in'}
      </button>
      <div aria-live="polite">{error && <p className="field-error">{error}</p>}</div>
    </div>
  );
}
