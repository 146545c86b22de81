'use client';

import { useState } from 'react';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { personName } from '@/lib/core/inputs/auth';
import { TextField } from '@/components/ui/text-field';

// Accepting signs the person in. A new account (or one without a name of its owner's choosing)
// gives the name other officials will see in staff lists and records.
export function AcceptInvitation({ token, needsName }: { token: string; needsName: boolean }) {
  const router = useRouter();
  const [isBusy, setBusy] = useState(false);
  const [error, setError] = useState<string>();
  const [nameError, setNameError] = useState<string>();
  async function accept(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setError(undefined);
    setNameError(undefined);
    let name: string | undefined;
    if (needsName) {
      const parsed = personName.safeParse(new FormData(e.currentTarget).get('name') ?? '');
      if (!parsed.success) return setNameError(parsed.error.issues[0]?.message ?? 'Enter your name.');
      name = parsed.data;
    }
    setBusy(true);
    const res = await signIn('invitation', { token, ...(name && { name }), redirect: false });
    setBusy(false);
    if (res?.error === 'NameInvalid') return setNameError('Enter your name: at most 120 characters, letters, spaces and punctuation.');
    if (!res || res.error) return setError('The invitation could not be accepted: it may have just expired or been used.');
    router.push('/home');
    router.refresh();
  }
  return (
    <form onSubmit={accept} noValidate>
      <fieldset disabled={isBusy} className="space-y-3">
        {needsName && (
          <TextField name="name" label="Your name" autoComplete="name" maxLength={120} required
            hint="As other officials and the stewards' records will show it. You can change it later in My account." error={nameError} />
        )}
        <button type="submit" className="btn-primary w-full">
          {isBusy ? 'Accepting…' : 'Accept and sign in'}
        </button>
        <div aria-live="polite">{error && <p className="field-error">{error}</p>}</div>
      </fieldset>
    </form>
  );
}
