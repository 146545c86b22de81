// Coarse redirect to sign-in for the signed-in areas. Never the only check: every page,
// action and handler asks the permission table itself.
import { withAuth } from 'next-auth/middleware';

export default withAuth({ pages: { signIn: '/sign-in' } });

export const config = {
  matcher: ['/home/:path*', '/account/:path*', '/organise/:path*', '/admin/:path*', '/boats/:path*', '/entries/:path*'],
};
