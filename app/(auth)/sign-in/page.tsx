import type { Metadata } from 'next';
import Link from '@/components/link';
import { SignInForm } from './sign-in-form';
import { safeRedirectPath } from '@/lib/core/safe-redirect';
import { appOrigin } from '@/lib/server/config/env';

export const metadata: Metadata = { title: 'Sign in' };

const MESSAGES: Record<string, string> = {
  CredentialsSignin: 'That e-mail and password do not match an account.',
  TooManyAttempts: 'Too many failed attempts: wait 15 minutes, or sign in with an e-mailed link.',
  AccountSuspended: 'This account is suspended. Ask the site administrator why, and to lift it.',
  Verification: 'That sign-in link has expired or was already used. Ask for a new one.',
  SessionRequired: 'Sign in to see that page.',
};

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<{ error?: string; callbackUrl?: string }>;
}) {
  const { error, callbackUrl } = await searchParams;
  const safeCallback = safeRedirectPath(callbackUrl, appOrigin());
  return (
    <div className="space-y-5">
      <h1 className="text-2xl">Sign in</h1>
      <SignInForm
        callbackUrl={safeCallback}
        initialError={error ? (MESSAGES[error] ?? 'Sign-in failed. Try again.') : undefined}
      />
      <p className="text-base">
        New entrant? <Link href="/sign-up">Create an account</Link>
      </p>
    </div>
  );
}
