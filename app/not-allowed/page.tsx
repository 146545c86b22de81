import type { Metadata } from 'next';
import Link from '@/components/link';
import { BrandMark } from '@/components/brand-mark';

export const metadata: Metadata = { title: 'Not allowed' };

export default function NotAllowedPage() {
  return (
    <main className="mx-auto flex min-h-screen max-w-lg flex-col items-start justify-center gap-4 px-4">
      <BrandMark className="h-12 w-12" />
      <h1 data-testid="not-allowed">Not allowed</h1>
      <p className="text-lg">
        Your account does not have the role this page needs. Staff roles are given per meeting by its organiser; if you
        should have access, ask them to invite you.
      </p>
      <div className="flex gap-3">
        <Link href="/home" className="btn-primary">
          Go to your home page
        </Link>
        <Link href="/sign-in" className="btn-secondary">
          Sign in as someone else
        </Link>
      </div>
    </main>
  );
}
