import { openReports } from '../access';

// Decides the reports page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function ReportsAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openReports(params);
  return children;
}
