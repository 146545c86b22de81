import { rolesCan, type Permission, type Role } from '@/lib/core/auth/permissions';

// Which areas of the signed-in shell a person sees, each behind the permission its landing page
// needs, read from the one permission table (lib/core/auth/permissions.ts). Navigation only: every
// page and handler still asks the table for itself.
export type NavItem = { href: string; label: string; permission: Permission };

export const NAV_ITEMS: readonly NavItem[] = [
  { href: '/home', label: 'Home', permission: 'account.view' },
  { href: '/boats', label: 'My boats', permission: 'boat.manage_own' },
  { href: '/entries', label: 'My entries', permission: 'entry.submit_own' },
  { href: '/protests', label: 'My protests', permission: 'protest.lodge' },
  { href: '/calculator', label: 'Jet calculator', permission: 'account.view' },
  { href: '/inspect', label: 'Inspect', permission: 'inspection.board' },
  { href: '/stewards', label: 'Stewards', permission: 'protest.view_all' },
  { href: '/appeals', label: 'Appeals', permission: 'appeal.hear' },
  { href: '/series', label: 'Series', permission: 'series.parity_view' },
  { href: '/organise', label: 'Organise', permission: 'event.create' },
  { href: '/admin', label: 'Administration', permission: 'admin.manage_users' },
  { href: '/account', label: 'My account', permission: 'account.view' },
];

/** The areas for every role a person holds anywhere (allRolesOf: everyone signed in is an entrant). */
export function navFor(roles: readonly Role[]): NavItem[] {
  return NAV_ITEMS.filter((item) => rolesCan(roles, item.permission));
}
