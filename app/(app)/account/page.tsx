import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getActor, allRolesOf } from '@/lib/auth/actor';
import { PasswordForm } from './password-form';

export const metadata: Metadata = { title: 'My account' };

export default async function AccountPage() {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const roles = allRolesOf(actor);
  return (
    <div className="max-w-xl space-y-6">
      <h1>My account</h1>
      <dl className="card grid grid-cols-[8rem_1fr] gap-y-2">
        <dt className="font-bold">Name</dt>
        <dd>{actor.name ?? '—'}</dd>
        <dt className="font-bold">E-mail</dt>
        <dd>{actor.email}</dd>
        <dt className="font-bold">Roles</dt>
        <dd data-testid="my-roles">{roles.join(', ')}</dd>
      </dl>
      <section className="card space-y-3">
        <h2 className="text-xl">Set a new password</h2>
        <PasswordForm />
      </section>
    </div>
  );
}
