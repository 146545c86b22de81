import { openMyProtest } from './access';

// Decides the protest page's status (sign-in, 404) before its loading.tsx streams anything (see access.ts).
export default async function ProtestAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ protestId: string }>;
}) {
  await openMyProtest(params);
  return children;
}
