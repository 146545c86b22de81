import 'server-only';
import type { User } from '@/models';

export type PersonView = {
  id: string;
  name: string | null;
  email: string;
  isAdmin: boolean;
  createdAt: string;
  suspendedAt: string | null;
  suspendedReason: string | null;
  isAppealBody: boolean; // on the governing body's appeal body (appeal_body_members)
};

export function toPersonView(u: User, isAppealBody: boolean): PersonView {
  return {
    id: u.id,
    name: u.name,
    email: u.email,
    isAdmin: u.isAdmin,
    createdAt: u.createdAt.toISOString(),
    suspendedAt: u.suspendedAt ? u.suspendedAt.toISOString() : null,
    suspendedReason: u.suspendedReason ?? null,
    isAppealBody,
  };
}
