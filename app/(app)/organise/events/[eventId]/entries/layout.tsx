import { openEntries } from '../access';

// Decides the entries page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function EntriesAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openEntries(params);
  return children;
}
