import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { format } from 'date-fns';
import { getActor, can } from '@/lib/auth/actor';
import { listPeople } from '@/lib/admin/list-people';

export const metadata: Metadata = { title: 'Administration' };

export default async function AdminPage() {
  const actor = await getActor();
  if (!can(actor, 'admin.manage_users')) redirect('/not-allowed');
  const people = await listPeople(actor);
  return (
    <div className="space-y-4">
      <h1>Administration</h1>
      <h2 className="text-xl">People ({people.length})</h2>
      <div className="card overflow-x-auto p-0">
        <table className="w-full text-left">
          <thead className="bg-paper-deep">
            <tr><th className="p-3">Name</th><th className="p-3">E-mail</th><th className="p-3">Site admin</th><th className="p-3">Joined</th></tr>
          </thead>
          <tbody>
            {people.map((p) => (
              <tr key={p.id} className="border-t border-paper-line">
                <td className="p-3">{p.name ?? '—'}</td>
                <td className="p-3">{p.email}</td>
                <td className="p-3">{p.isAdmin ? 'yes' : 'no'}</td>
                <td className="p-3">{format(new Date(p.createdAt), 'd MMM yyyy')}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
