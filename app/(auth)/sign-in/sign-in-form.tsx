'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { signInWith } from '@/components/sign-in';
import type { FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

const MESSAGES: Record<string, string> = {
  CredentialsSignin: 'That e-mail and password do not match an account.',
  TooManyAttempts: 'Too many failed attempts: wait 15 minutes, or sign in with an e-mailed link.',
  AccountSuspended: 'This account is suspended. Ask the site administrator why, and to lift it.',
  TooManyLinks: 'Too many sign-in links were asked for from here: wait a while, then try again.',
  Unavailable: 'Boreline could not be reached: check the connection and try again.',
};

export function SignInForm({ callbackUrl, initialError }: { callbackUrl: string; initialError?: string }) {
  const router = useRouter();
  const [mode, setMode] = useState<'password' | 'link'>('password');

  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const email = String(data.get('email') ?? '');
      // A refused link request (too many from this address) is not answered with next-auth's JSON: signInWith throws.
      const res = await (
        mode === 'password'
          ? signInWith('password', { email, password: String(data.get('password') ?? '') }, callbackUrl)
          : signInWith('email', { email }, callbackUrl)
      ).catch(() => ({ error: mode === 'link' ? 'TooManyLinks' : 'Unavailable' }));
      if (!res || res.error)
        return { ok: false, message: MESSAGES[res?.error ?? ''] ?? 'Sign-in failed. Check the address and try again.' };
      router.push(mode === 'password' ? callbackUrl : '/sign-in/check-email');
      router.refresh();
      return { ok: true };
    },
    { ok: false, message: initialError },
  );

  const error = state.ok ? undefined : state.message;
  return (
    <form {...form}>
      <fieldset disabled={isPending} className="space-y-4">
        <div role="group" aria-label="Sign-in method" className="grid grid-cols-2 gap-2">
          {(['password', 'link'] as const).map((m) => (
            <button
              key={m}
              type="button"
              aria-pressed={mode === m}
              onClick={() => setMode(m)}
              className={mode === m ? 'btn-primary' : 'btn-secondary'}
            >
              {m === 'password' ? 'Password' : 'E-mail me a link'}
            </button>
          ))}
        </div>
        <div>
          <label htmlFor="email" className="field-label">
            E-mail
          </label>
          <input id="email" name="email" type="email" autoComplete="email" required className="field-input" />
        </div>
        {mode === 'password' && (
          <div>
            <label htmlFor="password" className="field-label">
              Password
            </label>
            <input
              id="password"
              name="password"
              type="password"
              autoComplete="current-password"
              required
              className="field-input"
            />
          </div>
        )}
        <div aria-live="polite">
          {error && (
            <p id="sign-in-error" className="field-error" data-testid="sign-in-error">
              {error}
            </p>
          )}
        </div>
        <button type="submit" className="btn-primary w-full">
          {isPending ? 'Signing in…' : mode === 'password' ? 'Sign in' : 'Send the link'}
        </button>
      </fieldset>
    </form>
  );
}
