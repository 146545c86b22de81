'use client';

import { useActionState, useEffect } from 'react';
import { useRouter } from 'next/navigation';
import { changeNameAction } from './actions';
import { TextField } from '@/components/ui/text-field';

// The name others see: greetings, staff lists, the stewards' records.
export function NameForm({ name }: { name: string | null }) {
  const router = useRouter();
  const [state, action, isPending] = useActionState(changeNameAction, null);
  useEffect(() => {
    if (state?.ok) router.refresh();
  }, [state, router]);
  return (
    <form action={action}>
      <fieldset disabled={isPending} className="space-y-3">
        <TextField name="name" label="Your name" defaultValue={name ?? ''} autoComplete="name" maxLength={120}
          hint="As officials, stewards and the records show it." error={state?.fieldErrors?.name} />
        <button type="submit" className="btn-primary">{isPending ? 'Saving…' : 'Save name'}</button>
        <p aria-live="polite" data-testid="name-result" className={state?.ok ? 'font-bold text-pass-600' : 'field-error'}>{state?.message}</p>
      </fieldset>
    </form>
  );
}
