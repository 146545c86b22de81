import { openClassReport } from '../../../access';

// Decides the parity report page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function ClassReportAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string; classId: string }>;
}) {
  await openClassReport(params);
  return children;
}
