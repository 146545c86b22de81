import type { Metadata } from 'next';
import Link from '@/components/link';
import { SignUpForm } from './sign-up-form';

export const metadata: Metadata = { title: 'Create an account' };

export default function SignUpPage() {
  return (
    <div className="space-y-5">
      <h1 className="text-2xl">Create an entrant account</h1>
      <p className="text-ink-soft">
        Register your boats, enter classes and follow your inspections. Officials are invited by their organiser.
      </p>
      <SignUpForm />
      <p>
        Already have an account? <Link href="/sign-in">Sign in</Link>
      </p>
    </div>
  );
}
