import { openOrganise } from './access';

// Decides the organiser's area's status (sign-in, the role) before its loading.tsx streams anything (see access.ts).
export default async function OrganiseAccess({ children }: { children: React.ReactNode }) {
  await openOrganise();
  return children;
}
