import 'next-auth';

declare module 'next-auth' {
  interface Session {
    user?: { id?: string; name?: string | null; email?: string | null; image?: string | null };
  }
}
declare module 'next-auth/jwt' {
  interface JWT {
    uid?: string;
    sv?: number; // the session version it was issued under (lib/server/auth/sessions.ts)
  }
}
