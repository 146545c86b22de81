// GET|POST /api/auth/*: next-auth's own endpoints (sign-in, callbacks, session, sign-out).
import NextAuth from 'next-auth';
import { getAuthOptions } from '@/lib/auth/options';

type Ctx = { params: Promise<{ nextauth: string[] }> };

async function handler(req: Request, ctx: Ctx) {
  return NextAuth(req as never, ctx as never, getAuthOptions());
}

export { handler as GET, handler as POST };
