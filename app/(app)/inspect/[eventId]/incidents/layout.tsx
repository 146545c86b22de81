import { openIncidents } from '../access';

// Decides the incidents page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function IncidentsAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openIncidents(params);
  return children;
}
