import { openInstruments } from '../access';

// Decides the instruments page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function InstrumentsAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openInstruments(params);
  return children;
}
