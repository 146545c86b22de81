import { openInterests } from '../access';

// Decides the interest register's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function InterestsAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openInterests(params);
  return children;
}
