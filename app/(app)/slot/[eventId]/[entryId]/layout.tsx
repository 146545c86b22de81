import { openSlotPage } from './access';

// Decides the page's status (sign-in, 404) before its loading.tsx streams anything.
export default async function SlotPageAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string; entryId: string }>;
}) {
  const { eventId, entryId } = await params;
  await openSlotPage(eventId, entryId);
  return children;
}
