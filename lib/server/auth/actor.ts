import 'server-only';
import { cookies } from 'next/headers';
import { decode, getToken, type JWT, type JWTDecodeParams } from 'next-auth/jwt';
import { serverEnv } from '@/lib/server/config/env';
import { preparedQuery } from '@/lib/server/db/prepared-query';
import { rolesCan, type Permission, type Role } from '../../core/auth/permissions';
import { AppError } from '@/lib/core/errors';

// The signed-in person as every data-access function sees them: roles are read fresh from
// the database on each request, so a revoked staff role stops working at once.
export type Actor = {
  id: string;
  email: string;
  name: string | null;
  isAdmin: boolean;
  isAppealBody: boolean; // a member of the governing body's appeal body (above any single meeting)
  isAddressProven: boolean; // the owner followed a link sent to the address (lib/server/accounts/prove-address.ts)
  eventRoles: Record<string, Role[]>;
  seriesRoles: Record<string, Role[]>; // series_secretary / series_steward by series id
  organiserOf: string[]; // organisation ids where the person may create events
};

export async function loadActor(userId: string, sessionVersion: number): Promise<Actor | null> {
  // One round trip: this runs for every signed-in request. A suspended account has no actor, and a
  // session issued under an earlier session version is over (lib/server/auth/sessions.ts), so sign-out,
  // a password change or a suspension stop every open session at once.
  // Prepared: parsed and planned once per connection, not on every request.
  const [row] = await preparedQuery<{
    id: string;
    email: string;
    name: string | null;
    isAdmin: boolean;
    isAppealBody: boolean;
    isAddressProven: boolean;
    staff: { eventId: string; role: Role }[];
    seriesStaff: { seriesId: string; role: Role }[];
    organiserOf: string[];
  }>(
    'actor:load',
    `select u.id, u.email, u.name, u.is_admin as "isAdmin",
            exists (select 1 from appeal_body_members a where a.user_id = u.id) as "isAppealBody", u.email_verified is not null as "isAddressProven",
            coalesce((select json_agg(json_build_object('eventId', s.event_id, 'role', s.role)) from event_staff s where s.user_id = u.id), '[]') as staff,
            coalesce((select json_agg(json_build_object('seriesId', o.series_id, 'role', o.role)) from series_officials o where o.user_id = u.id), '[]') as "seriesStaff",
            coalesce((select json_agg(m.organisation_id) from organisation_members m where m.user_id = u.id and m.role = 'organiser'), '[]') as "organiserOf"
       from users u where u.id = :userId and u.suspended_at is null and u.session_version = :sessionVersion`,
    { userId, sessionVersion },
  );
  if (!row) return null;
  const eventRoles: Record<string, Role[]> = {};
  for (const s of row.staff) (eventRoles[s.eventId] ??= []).push(s.role);
  const seriesRoles: Record<string, Role[]> = {};
  for (const s of row.seriesStaff) (seriesRoles[s.seriesId] ??= []).push(s.role);
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    isAdmin: row.isAdmin,
    isAppealBody: row.isAppealBody,
    isAddressProven: row.isAddressProven,
    eventRoles,
    seriesRoles,
    organiserOf: row.organiserOf,
  };
}

// Session tokens this process has already decrypted, by their exact text: next-auth derives the key
// (HKDF) and decrypts the token (JWE) on every request, the largest piece of a signed-in request's own
// work in the recording benchmark's profile. Only a token that decrypted with the secret is kept, and
// only until its own expiry; the person, roles and session version are still read from the database
// on every request (loadActor), so ending sessions or removing a role works at once as before.
// Bounded: the oldest entry goes first.
const DECODED_TOKENS_MAX = 2000;
const globalForTokens = globalThis as unknown as { __borelineDecodedTokens?: Map<string, JWT> };

async function decodeOnce(params: JWTDecodeParams): Promise<JWT | null> {
  const cache = (globalForTokens.__borelineDecodedTokens ??= new Map());
  const text = params.token;
  if (!text) return null;
  const known = cache.get(text);
  if (known) {
    if (typeof known.exp === 'number' && known.exp * 1000 > Date.now()) return known;
    cache.delete(text);
  }
  const token = await decode(params); // throws for a token that is not ours; getToken answers null
  if (token && typeof token.exp === 'number') {
    if (cache.size >= DECODED_TOKENS_MAX) cache.delete(cache.keys().next().value!);
    cache.set(text, Object.freeze(token));
  }
  return token;
}

/**
 * The person behind this request's session cookie. Only the cookie is read (next-auth's getToken
 * decrypts and checks its expiry): getServerSession would also re-sign a fresh token on every call,
 * which a server component or route handler cannot even send back, at a key derivation and an
 * encryption per request. A Bearer header is not accepted: sessions are cookies only.
 */
export async function getActor(): Promise<Actor | null> {
  const jar = await cookies();
  const token = await getToken({
    req: { cookies: Object.fromEntries(jar.getAll().map((c) => [c.name, c.value])), headers: {} } as never,
    secret: serverEnv().NEXTAUTH_SECRET, // the secret next-auth signs with (lib/server/auth/options.ts)
    decode: decodeOnce,
  });
  const id = typeof token?.uid === 'string' ? token.uid : null;
  // A token from before session versions counts as version 0.
  const version = typeof token?.sv === 'number' && Number.isInteger(token.sv) ? token.sv : 0;
  return id ? loadActor(id, version) : null;
}

/** Roles a person holds in a scope: everyone signed in is an entrant; staff roles are per event. */
export function rolesOf(
  actor: Actor,
  scope: { eventId?: string; organisationId?: string; seriesId?: string } = {},
): Role[] {
  const roles: Role[] = ['entrant'];
  if (actor.isAdmin) roles.push('admin');
  if (actor.isAppealBody) roles.push('appeal_body');
  if (scope.eventId) roles.push(...(actor.eventRoles[scope.eventId] ?? []));
  if (scope.seriesId) roles.push(...(actor.seriesRoles[scope.seriesId] ?? []));
  if (scope.organisationId && actor.organiserOf.includes(scope.organisationId)) roles.push('organiser');
  return roles;
}

/** Every role the person holds anywhere (for navigation only; never for a permission check). */
export function allRolesOf(actor: Actor): Role[] {
  const set = new Set<Role>(rolesOf(actor));
  for (const roles of Object.values(actor.eventRoles)) roles.forEach((r) => set.add(r));
  for (const roles of Object.values(actor.seriesRoles)) roles.forEach((r) => set.add(r));
  if (actor.organiserOf.length) set.add('organiser');
  return [...set];
}

export function can(
  actor: Actor | null,
  permission: Permission,
  scope: { eventId?: string; organisationId?: string; seriesId?: string } = {},
) {
  return !!actor && rolesCan(rolesOf(actor, scope), permission);
}

export function assertCan(
  actor: Actor | null,
  permission: Permission,
  scope: { eventId?: string; organisationId?: string; seriesId?: string } = {},
): asserts actor is Actor {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  if (!can(actor, permission, scope)) throw new AppError('forbidden', 403, 'You are not allowed to do this.');
}
