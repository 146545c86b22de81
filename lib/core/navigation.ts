import type { Role } from '@/lib/core/auth/permissions';

// Which areas of the signed-in shell each role sees. Navigation only: every page and
// handler still asks the permission table for itself.
export type NavItem = { href: string; label: string; roles: readonly Role[] };

export const NAV_ITEMS: readonly NavItem[] = [
  { href: '/home', label: 'Home', roles: ['entrant'] },
  { href: '/boats', label: 'My boats', roles: ['entrant'] },
  { href: '/entries', label: 'My entries', roles: ['entrant'] },
  { href: '/protests', label: 'My protests', roles: ['entrant'] },
  { href: '/calculator', label: 'Jet calculator', roles: ['entrant'] },
  { href: '/inspect', label: 'Inspect', roles: ['scrutineer', 'chief_scrutineer', 'organiser'] },
  { href: '/stewards', label: 'Stewards', roles: ['steward', 'organiser'] },
  { href: '/organise', label: 'Organise', roles: ['organiser', 'admin'] },
  { href: '/admin', label: 'Administration', roles: ['admin'] },
  { href: '/account', label: 'My account', roles: ['entrant'] },
];

export function navFor(roles: readonly Role[]): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.some((r) => roles.includes(r)));
}
