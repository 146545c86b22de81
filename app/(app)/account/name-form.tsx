'use client';

import { useEffect } from 'react';
import { useRouter } from 'next/navigation';
import { changeNameAction } from './actions';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/forms/form-message';
import { useFormAction } from '@/components/forms/use-form-action';

// The name others see: greetings, staff lists, the stewards' records.
export function NameForm({ name }: { name: string | null }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(changeNameAction, null);
  useEffect(() => {
    if (state?.ok) router.refresh();
  }, [state, router]);
  return (
    <form {...form}>
      <fieldset disabled={isPending} className="space-y-3">
        <TextField
          name="name"
          label="Your name"
          defaultValue={name ?? ''}
          autoComplete="name"
          maxLength={120}
          hint="As officials, stewards and the records show it."
          error={state?.fieldErrors?.name}
        />
        <FormMessage state={state} testId="name-result" />
        <button type="submit" className="btn-primary">
          {isPending ? 'Saving…' : 'Save name'}
        </button>
      </fieldset>
    </form>
  );
}
