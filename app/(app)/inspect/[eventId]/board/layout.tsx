import { openBoard } from '../access';

// Decides the board's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function BoardAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openBoard(params);
  return children;
}
