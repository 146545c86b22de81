import type { Metadata } from 'next';
import Link from 'next/link';

export const metadata: Metadata = { title: 'Check your e-mail' };
export const dynamic = 'force-dynamic';

export default function CheckEmailPage() {
  const showOutbox = process.env.BORELINE_DEV_TOOLS === '1';
  return (
    <div className="space-y-4">
      <h1 className="text-2xl">Check your e-mail</h1>
      <p>We sent a sign-in link. It works once and expires in 30 minutes.</p>
      {showOutbox && (
        <p className="rounded-lg bg-tide-50 p-3">
          Development: messages go to the local mail fake. <Link href="/dev/outbox">Open the outbox</Link>.
        </p>
      )}
    </div>
  );
}
