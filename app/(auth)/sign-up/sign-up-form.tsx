'use client';

import { useState } from 'react';
import { SignUpInput } from '@/lib/core/inputs/auth';
import { fieldErrors } from '@/lib/core/errors';
import { TextField } from '@/components/ui/text-field';

type Errors = Partial<Record<'name' | 'email' | 'password' | 'form', string>>;

export function SignUpForm() {
  const [errors, setErrors] = useState<Errors>({});
  const [isBusy, setBusy] = useState(false);
  const [sentTo, setSentTo] = useState<string | null>(null);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const raw = Object.fromEntries(new FormData(e.currentTarget));
    const parsed = SignUpInput.safeParse(raw);
    if (!parsed.success) {
      setErrors(fieldErrors(parsed.error));
      return;
    }
    setBusy(true);
    setErrors({});
    const res = await fetch('/api/accounts', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(parsed.data),
    });
    if (!res.ok) {
      const body = await res.json().catch(() => null);
      const next: Errors = {};
      for (const d of body?.error?.details ?? []) next[d.field as keyof Errors] ??= d.message;
      if (Object.keys(next).length === 0) next.form = body?.error?.message ?? 'Sign-up failed. Try again.';
      setErrors(next);
      setBusy(false);
      return;
    }
    setBusy(false);
    setSentTo(parsed.data.email);
  }

  if (sentTo) {
    // The same answer whether or not the address already had an account (nothing to learn here).
    return (
      <div role="status" className="card space-y-2" data-testid="sign-up-sent">
        <h2 className="text-xl">Check your mailbox</h2>
        <p>
          We sent a message to <strong>{sentTo}</strong>. Follow its link and give your password to confirm the address: you
          need a confirmed address to enter classes, pay fees or serve on a meeting&apos;s staff.
        </p>
        <p className="text-ink-soft">Nothing arrived after a few minutes? Check the spam folder, or sign in and ask for a new link on My account.</p>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate>
      <fieldset disabled={isBusy} className="space-y-4">
        <TextField name="name" label="Your name" autoComplete="name" error={errors.name} />
        <TextField name="email" label="E-mail" type="email" autoComplete="email" error={errors.email} />
        <TextField name="password" label="Password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password} />
        <div aria-live="polite">{errors.form && <p className="field-error">{errors.form}</p>}</div>
        <button type="submit" className="btn-primary w-full">{isBusy ? 'Creating…' : 'Create account'}</button>
      </fieldset>
    </form>
  );
}
