import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getActor, allRolesOf } from '@/lib/server/auth/actor';
import { getAccountSummary } from '@/lib/server/accounts/account-summary';
import { NameForm } from './name-form';
import { PasswordForm } from './password-form';
import { ResendProofForm, SignOutEverywhereForm } from './session-controls';

export const metadata: Metadata = { title: 'My account' };

export default async function AccountPage() {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const roles = allRolesOf(actor);
  const summary = await getAccountSummary(actor);
  return (
    <div className="max-w-xl space-y-6">
      <h1>My account</h1>
      <dl className="card grid grid-cols-[8rem_1fr] gap-y-2">
        <dt className="font-bold">Name</dt>
        <dd data-testid="account-name">{actor.name ?? 'not given yet'}</dd>
        <dt className="font-bold">E-mail</dt>
        <dd className="break-all">
          {actor.email}{' '}
          <span
            data-testid="address-state"
            className={
              actor.isAddressProven
                ? 'inline-block rounded-full bg-pass-100 px-3 py-1 text-sm font-bold text-pass-800'
                : 'inline-block rounded-full bg-doubt-100 px-3 py-1 text-sm font-bold text-doubt-800'
            }
          >
            {actor.isAddressProven ? 'confirmed' : 'not confirmed'}
          </span>
        </dd>
        <dt className="font-bold">Roles</dt>
        <dd data-testid="my-roles">{roles.join(', ')}</dd>
      </dl>
      {!actor.isAddressProven && (
        <section className="card space-y-3" aria-labelledby="confirm-heading">
          <h2 id="confirm-heading" className="text-xl">
            Confirm your address
          </h2>
          <p>
            Follow the link we sent to {actor.email} to confirm it is yours. Until then you cannot pay entry or protest
            fees, and organisers can only invite you to a meeting&apos;s staff through that mailbox.
          </p>
          <ResendProofForm />
        </section>
      )}
      <section className="card space-y-3" aria-labelledby="name-heading">
        <h2 id="name-heading" className="text-xl">
          {actor.name ? 'Change your name' : 'Give your name'}
        </h2>
        <NameForm name={actor.name} />
      </section>
      <section className="card space-y-3">
        <h2 className="text-xl">{summary.hasPassword ? 'Change your password' : 'Set a password'}</h2>
        <PasswordForm email={actor.email} hasPassword={summary.hasPassword} />
      </section>
      <section className="card space-y-3" aria-labelledby="sessions-heading">
        <h2 id="sessions-heading" className="text-xl">
          Sessions
        </h2>
        <p>Lost a phone, or signed in on a shared computer? End every session of this account on every device.</p>
        <SignOutEverywhereForm />
      </section>
    </div>
  );
}
