import 'server-only';
import { getServerSession } from 'next-auth';
import { getAuthOptions } from './options';
import { db } from '@/lib/db';
import { rolesCan, type Permission, type Role } from './permissions';
import { AppError } from '@/lib/http/errors';

// The signed-in person as every data-access function sees them: roles are read fresh from
// the database on each request, so a revoked staff role stops working at once.
export type Actor = {
  id: string;
  email: string;
  name: string | null;
  isAdmin: boolean;
  eventRoles: Record<string, Role[]>;
  organiserOf: string[]; // organisation ids where the person may create events
};

export async function loadActor(userId: string): Promise<Actor | null> {
  const { User, EventStaff, OrganisationMember } = db();
  const user = await User.findByPk(userId);
  if (!user) return null;
  const [staff, memberships] = await Promise.all([
    EventStaff.findAll({ where: { userId }, attributes: ['eventId', 'role'] }),
    OrganisationMember.findAll({ where: { userId, role: 'organiser' }, attributes: ['organisationId'] }),
  ]);
  const eventRoles: Record<string, Role[]> = {};
  for (const s of staff) (eventRoles[s.eventId] ??= []).push(s.role as Role);
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    isAdmin: user.isAdmin,
    eventRoles,
    organiserOf: memberships.map((m) => m.organisationId),
  };
}

export async function getActor(): Promise<Actor | null> {
  const session = await getServerSession(getAuthOptions());
  const id = session?.user?.id;
  return id ? loadActor(id) : null;
}

/** Roles a person holds in a scope: everyone signed in is an entrant; staff roles are per event. */
export function rolesOf(actor: Actor, scope: { eventId?: string; organisationId?: string } = {}): Role[] {
  const roles: Role[] = ['entrant'];
  if (actor.isAdmin) roles.push('admin');
  if (scope.eventId) roles.push(...(actor.eventRoles[scope.eventId] ?? []));
  if (scope.organisationId && actor.organiserOf.includes(scope.organisationId)) roles.push('organiser');
  return roles;
}

/** Every role the person holds anywhere (for navigation only; never for a permission check). */
export function allRolesOf(actor: Actor): Role[] {
  const set = new Set<Role>(rolesOf(actor));
  for (const roles of Object.values(actor.eventRoles)) roles.forEach((r) => set.add(r));
  if (actor.organiserOf.length) set.add('organiser');
  return [...set];
}

export function can(actor: Actor | null, permission: Permission, scope: { eventId?: string; organisationId?: string } = {}) {
  return !!actor && rolesCan(rolesOf(actor, scope), permission);
}

export function assertCan(actor: Actor | null, permission: Permission, scope: { eventId?: string; organisationId?: string } = {}): asserts actor is Actor {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  if (!can(actor, permission, scope)) throw new AppError('forbidden', 403, 'You are not allowed to do this.');
}
