// Runs before routing. 1) An address whose percent-encoding is not valid UTF-8 cannot name
// anything: answer 400 in the one error shape (Next would otherwise fail decoding it with a 500).
// 2) Every page gets a fresh CSP nonce (lib/server/http/content-security-policy.ts): the policy goes on the
// request, where Next reads the nonce for its own scripts, and on the response.
// 3) Coarse redirect to sign-in for the signed-in areas. Never the only check: every page,
// action and handler asks the permission table itself.
import { NextResponse, type NextFetchEvent, type NextRequest } from 'next/server';
import { withAuth, type NextRequestWithAuth } from 'next-auth/middleware';
import { newNonce, pageCsp } from '@/lib/server/http/content-security-policy';

const SIGNED_IN_AREAS = /^\/(home|account|organise|admin|boats|entries|inspect|protests|appeals|stewards)(\/|$)/;

function withNonce(req: NextRequest): NextResponse {
  if (req.nextUrl.pathname.startsWith('/api/')) return NextResponse.next(); // JSON: next.config.mjs sets its policy
  const csp = pageCsp(newNonce());
  const headers = new Headers(req.headers);
  headers.set('content-security-policy', csp);
  const res = NextResponse.next({ request: { headers } });
  res.headers.set('content-security-policy', csp);
  return res;
}

const requireSignIn = withAuth((req) => withNonce(req), { pages: { signIn: '/sign-in' } });

export default function proxy(req: NextRequest, event: NextFetchEvent) {
  try {
    decodeURIComponent(req.nextUrl.pathname);
  } catch {
    return NextResponse.json(
      { error: { code: 'bad_path', message: 'The address is not valid: it contains broken character encoding.' } },
      { status: 400 },
    );
  }
  if (SIGNED_IN_AREAS.test(req.nextUrl.pathname)) return requireSignIn(req as NextRequestWithAuth, event);
  return withNonce(req);
}

// API requests that carry a body skip the proxy: passing through it would make Next buffer the
// whole body before the route handler can refuse an oversized upload by its Content-Length. The
// exception is an API address with a percent sign in it (no Boreline id or token has one): it
// comes here so that broken encoding gets the 400 above rather than Next's own 500.
export const config = {
  matcher: [
    '/((?!api/|_next/static|_next/image|fonts/|favicon.ico).*)',
    {
      source: '/api/:path*',
      missing: [
        { type: 'header', key: 'content-length' },
        { type: 'header', key: 'transfer-encoding' },
      ],
    },
    '/api/:path(.*%.*)',
  ],
};
