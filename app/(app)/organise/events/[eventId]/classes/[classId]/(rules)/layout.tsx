import { openClassRules } from '../../../access';

// Decides the class rules page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function ClassRulesAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string; classId: string }>;
}) {
  await openClassRules(params);
  return children;
}
