import type { Metadata } from 'next';
import Link from '@/components/link';
import { findInvitation } from '@/lib/server/auth/invitations';
import { AcceptInvitation } from './accept-invitation';

export const metadata: Metadata = { title: 'Staff invitation' };
export const dynamic = 'force-dynamic';

const ROLE_LABEL: Record<string, string> = {
  organiser: 'Organiser',
  chief_scrutineer: 'Chief scrutineer',
  scrutineer: 'Scrutineer',
  steward: 'Steward',
};

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const inv = await findInvitation(token);
  if (!inv || !inv.isUsable) {
    return (
      <div className="space-y-4">
        <h1 className="text-2xl">This invitation cannot be used</h1>
        <p>
          It may have expired or already been accepted. Ask the organiser to send a new one, or{' '}
          <Link href="/sign-in">sign in</Link>.
        </p>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <h1 className="text-2xl">Join {inv.eventName}</h1>
      <p>
        You are invited as <strong>{ROLE_LABEL[inv.role] ?? inv.role}</strong> at {inv.eventName}, {inv.venue}, signing
        in as <strong>{inv.email}</strong>.
      </p>
      <AcceptInvitation token={token} needsName={inv.needsName} />
    </div>
  );
}
