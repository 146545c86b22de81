import type { Metadata } from 'next';
import Link from '@/components/link';
import { findInvitation } from '@/lib/server/auth/invitations';
import { AcceptInvitation } from './accept-invitation';

export const metadata: Metadata = { title: 'Invitation' };
export const dynamic = 'force-dynamic';

const ROLE_LABEL: Record<string, string> = {
  organiser: 'Organiser',
  chief_scrutineer: 'Chief scrutineer',
  scrutineer: 'Scrutineer',
  steward: 'Steward',
  series_secretary: 'Series secretary',
  series_steward: 'Series steward',
};

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const inv = await findInvitation(token);
  if (!inv || !inv.isUsable) {
    return (
      <div className="space-y-4">
        <h1 className="text-2xl">This invitation cannot be used</h1>
        <p>
          It may have expired or already been accepted. Ask whoever invited you to send a new one, or{' '}
          <Link href="/sign-in">sign in</Link>.
        </p>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <h1 className="text-2xl">Join {inv.placeName}</h1>
      <p>
        You are invited as <strong>{ROLE_LABEL[inv.role] ?? inv.role}</strong> {inv.scope === 'series' ? 'of' : 'at'}{' '}
        {inv.placeName}, {inv.placeDetail}, signing in as <strong>{inv.email}</strong>.
        {inv.scope === 'series' && ' You hold the role once you accept.'}
      </p>
      <AcceptInvitation token={token} needsName={inv.needsName} />
    </div>
  );
}
