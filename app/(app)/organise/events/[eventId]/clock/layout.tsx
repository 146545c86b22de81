import { openResults } from '../access';

// Decides the clock page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function ClockAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openResults(params);
  return children;
}
