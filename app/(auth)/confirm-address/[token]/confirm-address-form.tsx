'use client';

import { useRouter } from 'next/navigation';
import { signInWith } from '@/components/sign-in';
import { TextField } from '@/components/ui/text-field';
import type { FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

export function ConfirmAddressForm({ token }: { token: string }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const password = String(data.get('password') ?? '');
      if (!password) return { ok: false, fieldErrors: { password: 'Enter the password you chose at sign-up.' } };
      const res = await signInWith('address-proof', { token, password }).catch(() => null);
      if (!res || res.error)
        return {
          ok: false,
          fieldErrors: {
            password:
              'That did not work: check the password, or the link may have expired (My account sends a new one).',
          },
        };
      router.push('/account?confirmed=1');
      router.refresh();
      return { ok: true };
    },
    { ok: false },
  );
  return (
    <form {...form}>
      <fieldset disabled={isPending} className="space-y-3">
        <TextField
          name="password"
          label="Your password"
          type="password"
          autoComplete="current-password"
          error={state.fieldErrors?.password}
        />
        <button type="submit" className="btn-primary w-full">
          {isPending ? 'Confirming…' : 'Confirm and sign in'}
        </button>
      </fieldset>
    </form>
  );
}
