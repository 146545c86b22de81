'use client';

import { useRouter } from 'next/navigation';
import { signInWith } from '@/components/sign-in';
import { personName } from '@/lib/core/inputs/auth';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/forms/form-message';
import type { FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

// Accepting signs the person in. A new account (or one without a name of its owner's choosing)
// gives the name other officials will see in staff lists and records.
export function AcceptInvitation({ token, needsName }: { token: string; needsName: boolean }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      let name: string | undefined;
      if (needsName) {
        const parsed = personName.safeParse(data.get('name') ?? '');
        if (!parsed.success)
          return { ok: false, fieldErrors: { name: parsed.error.issues[0]?.message ?? 'Enter your name.' } };
        name = parsed.data;
      }
      const res = await signInWith('invitation', { token, ...(name && { name }) }).catch(() => null);
      if (res?.error === 'NameInvalid')
        return {
          ok: false,
          fieldErrors: { name: 'Enter your name: at most 120 characters, letters, spaces and punctuation.' },
        };
      if (!res || res.error)
        return { ok: false, message: 'The invitation could not be accepted: it may have just expired or been used.' };
      router.push('/home');
      router.refresh();
      return { ok: true };
    },
    { ok: false },
  );
  return (
    <form {...form}>
      <fieldset disabled={isPending} className="space-y-3">
        {needsName && (
          <TextField
            name="name"
            label="Your name"
            autoComplete="name"
            maxLength={120}
            required
            hint="As other officials and the stewards' records will show it. You can change it later in My account."
            error={state.fieldErrors?.name}
          />
        )}
        <FormMessage state={state} />
        <button type="submit" className="btn-primary w-full">
          {isPending ? 'Accepting…' : 'Accept and sign in'}
        </button>
      </fieldset>
    </form>
  );
}
