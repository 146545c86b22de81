import { openDock } from '../access';

// Decides the dock screen's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function DockAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openDock(params);
  return children;
}
