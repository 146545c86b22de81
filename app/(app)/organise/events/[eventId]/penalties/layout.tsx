import { openPenaltyCatalogue } from '../access';

// Decides the catalogue page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function PenaltyCatalogueAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openPenaltyCatalogue(params);
  return children;
}
