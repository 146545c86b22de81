'use client';

import { SignUpInput } from '@/lib/core/inputs/auth';
import { fieldErrors } from '@/lib/core/errors';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

type State = FormState & { sentTo?: string };

async function signUp(_prev: State, form: FormData): Promise<State> {
  const parsed = SignUpInput.safeParse(Object.fromEntries(form));
  if (!parsed.success) return { ok: false, fieldErrors: fieldErrors(parsed.error) };
  const answer = await requestJson('/api/accounts', {
    body: parsed.data,
    fallbackMessage: 'Sign-up failed. Try again.',
  });
  if (!answer.ok) return refusalState(answer);
  return { ok: true, sentTo: parsed.data.email };
}

export function SignUpForm() {
  const { state, isPending, form } = useFormAction(signUp, { ok: false });

  if (state.ok && state.sentTo) {
    // The same answer whether or not the address already had an account (nothing to learn here).
    return (
      <div role="status" className="card space-y-2" data-testid="sign-up-sent">
        <h2 className="text-xl">Check your mailbox</h2>
        <p>
          We sent a message to <strong>{state.sentTo}</strong>. Follow its link and give your password to confirm the
          address: you need a confirmed address to enter classes, pay fees or serve on a meeting&apos;s staff.
        </p>
        <p className="text-ink-soft">
          Nothing arrived after a few minutes? Check the spam folder, or sign in and ask for a new link on My account.
        </p>
      </div>
    );
  }

  const errors = state.fieldErrors ?? {};
  return (
    <form {...form}>
      <fieldset disabled={isPending} className="space-y-4">
        <TextField name="name" label="Your name" autoComplete="name" error={errors.name} />
        <TextField name="email" label="E-mail" type="email" autoComplete="email" error={errors.email} />
        <TextField
          name="password"
          label="Password"
          type="password"
          autoComplete="new-password"
          hint="At least 10 characters."
          error={errors.password}
        />
        <FormMessage state={state} />
        <button type="submit" className="btn-primary w-full">
          {isPending ? 'Creating…' : 'Create account'}
        </button>
      </fieldset>
    </form>
  );
}
