import { openSeals } from '../access';

// Decides the seal register's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function SealsAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openSeals(params);
  return children;
}
