import { openCustody } from '../access';

// Decides the custody page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function CustodyAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openCustody(params);
  return children;
}
