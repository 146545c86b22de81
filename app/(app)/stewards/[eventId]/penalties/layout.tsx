import { openPenalties } from '../access';

// Decides the penalty screen's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function PenaltiesAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openPenalties(params);
  return children;
}
