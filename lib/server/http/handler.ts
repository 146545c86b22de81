import 'server-only';
import type { NextRequest } from 'next/server';
import { getActor, assertCan, type Actor } from '@/lib/server/auth/actor';
import type { Permission } from '@/lib/core/auth/permissions';
import { AppError, toErrorResponse } from '../../core/errors';
import { readJsonBody, readOptionalJsonBody } from './read-body';
import { logger } from '@/lib/server/observability';

type Params = Record<string, string | string[]>;
type Ctx<P> = { params: Promise<P> };

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** Refuses cross-site state-changing requests: a browser's Origin must match the app's host. */
export function checkOrigin(req: Request) {
  if (!STATE_CHANGING.has(req.method)) return;
  const origin = req.headers.get('origin');
  if (!origin) return; // non-browser clients (scripts, tests) send none; cookies alone are not enough for them
  const host = req.headers.get('x-forwarded-host') ?? req.headers.get('host');
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    throw new AppError('bad_origin', 403, 'This request came from another site.');
  }
  if (originHost !== host) throw new AppError('bad_origin', 403, 'This request came from another site.');
}

/** Wraps a public route handler: origin check and the one error shape (with the request's id). */
export function publicHandler<P extends Params = Params>(
  fn: (req: NextRequest, ctx: { params: P }) => Promise<Response>,
) {
  return async (req: NextRequest, ctx: Ctx<P>) => {
    try {
      checkOrigin(req);
      return await fn(req, { params: await ctx.params });
    } catch (err) {
      const requestId = req.headers.get('x-request-id');
      return toErrorResponse(err, {
        requestId,
        onUnexpected: (e) => logger().error({ requestId, err: e, path: req.nextUrl.pathname }, 'unexpected error'),
      });
    }
  };
}

/** Wraps a signed-in route handler; the permission check runs with the scope the handler names. */
export function actorHandler<P extends Params = Params>(
  fn: (req: NextRequest, ctx: { params: P; actor: Actor }) => Promise<Response>,
) {
  return publicHandler<P>(async (req, { params }) => {
    const actor = await getActor();
    if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
    return fn(req, { params, actor });
  });
}

/** Wraps a handler that needs one permission, scoped by a path parameter (eventId, seriesId) when present. */
export function withPermission<P extends Params = Params>(
  permission: Permission,
  fn: (req: NextRequest, ctx: { params: P; actor: Actor }) => Promise<Response>,
) {
  return actorHandler<P>(async (req, ctx) => {
    const eventId = typeof ctx.params.eventId === 'string' ? ctx.params.eventId : undefined;
    const seriesId = typeof ctx.params.seriesId === 'string' ? ctx.params.seriesId : undefined;
    assertCan(ctx.actor, permission, { eventId, seriesId });
    return fn(req, ctx);
  });
}

/** Reads a JSON body with a size cap (lib/server/http/read-body.ts: refused past the cap, with or without Content-Length). */
export const readJson = readJsonBody;
/** readJson for a body that may be left out (Content-Length 0 reads as {}). */
export const readOptionalJson = readOptionalJsonBody;
