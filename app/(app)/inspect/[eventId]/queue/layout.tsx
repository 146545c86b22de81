import { openQueue } from '../access';

// Decides the queue page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function QueueAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openQueue(params);
  return children;
}
