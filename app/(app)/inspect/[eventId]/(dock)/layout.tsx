import { openDock } from '../access';

// Decides the dock screen's status (sign-in, 404, permission) before the page renders (see access.ts). The dock has
// no loading.tsx: the screen's heading and finder come in the first HTML, not revealed by React after its scripts.
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
