import type { Metadata } from 'next';
import Link from '@/components/link';
import { findAddressProof } from '@/lib/server/accounts/prove-address';
import { ConfirmAddressForm } from './confirm-address-form';

export const metadata: Metadata = { title: 'Confirm your address' };
export const dynamic = 'force-dynamic';

// Opening the link changes nothing (mail scanners open links too): the owner confirms with the
// password chosen at sign-up, which also signs them in.
export default async function ConfirmAddressPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const proof = await findAddressProof(token);
  if (!proof?.isUsable) {
    return (
      <div className="space-y-4">
        <h1 className="text-2xl">This link cannot be used</h1>
        <p>
          It may have expired, been used already, or the address is already confirmed.{' '}
          <Link href="/sign-in">Sign in</Link> and ask for a new link on My account if your address still shows as not
          confirmed.
        </p>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <h1 className="text-2xl">Confirm your address</h1>
      <p>
        Confirm that <strong>{proof.email}</strong> is yours by giving the password you chose when you created the
        account.
      </p>
      <ConfirmAddressForm token={token} />
      <p className="text-ink-soft">
        Did not create this account? Do not confirm: <Link href="/sign-in">sign in with an e-mailed link</Link> instead,
        which makes the account yours and removes the password somebody else chose.
      </p>
    </div>
  );
}
