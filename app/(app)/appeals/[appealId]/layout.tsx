import { openAppeal } from './access';

// Decides the appeal page's status (sign-in, 404) before its loading.tsx streams anything (see access.ts).
export default async function AppealAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ appealId: string }>;
}) {
  await openAppeal(params);
  return children;
}
