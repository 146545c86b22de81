import { openAudit } from '../access';

// Decides the audit trail's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function AuditAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openAudit(params);
  return children;
}
