import { openSlots } from '../access';

// Decides the slots page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function SlotsAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openSlots(params);
  return children;
}
