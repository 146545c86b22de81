import { openAdministration } from './access';

// Decides the administration page's status (the permission) before its loading.tsx streams anything (see access.ts).
export default async function AdministrationAccess({ children }: { children: React.ReactNode }) {
  await openAdministration();
  return children;
}
