import type { Metadata } from 'next';
import Link from '@/components/link';
import { serverEnv } from '@/lib/server/config/env';

export const metadata: Metadata = { title: 'Check your e-mail' };
export const dynamic = 'force-dynamic';

export default function CheckEmailPage() {
  const showOutbox = serverEnv().BORELINE_DEV_TOOLS;
  return (
    <div className="space-y-4">
      <h1 className="text-2xl">Check your e-mail</h1>
      <p>We sent a sign-in link. It works once and expires in 30 minutes.</p>
      {showOutbox && (
        <p className="rounded-lg bg-tide-50 p-3">
          Demo: e-mail goes to a local mail fake. Only the site administrator can read it, in the{' '}
          <Link href="/dev/outbox">outbox</Link>: it holds everybody&apos;s sign-in links.
        </p>
      )}
    </div>
  );
}
