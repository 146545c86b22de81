import { openStartList } from '../access';

// Decides the start list's status (sign-in, 404, permission) before anything streams (see access.ts).
export default async function StartListAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openStartList(params);
  return children;
}
