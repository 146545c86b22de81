import { openStewardProtest } from '../../access';

// Decides the protest page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function StewardProtestAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string; protestId: string }>;
}) {
  await openStewardProtest(params);
  return children;
}
