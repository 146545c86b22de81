import 'server-only';
import { isDatabaseDown } from '@/lib/core/errors';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import EmailProvider from 'next-auth/providers/email';
import SequelizeAdapter from '@next-auth/sequelize-adapter';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { sendMail, linkMail } from '@/lib/server/mail/send';
import { getClientAddress } from '@/lib/server/http/client-address';
import { safeRedirectPath } from '@/lib/core/safe-redirect';
import { recordAttempt } from './throttle';
import { acceptInvitation } from './invitations';
import { checkPasswordSignIn } from './password-sign-in';
import { endAllSessions, wipeUnprovenPassword } from './sessions';
import { proveAddress } from '@/lib/server/accounts/prove-address';
import { appUrl, serverEnv } from '@/lib/server/config/env';

// E-mailed sign-in links per address asked for: a few an hour, so nobody can flood a mailbox.
const LINKS_PER_ADDRESS_PER_HOUR = 5;

let cached: NextAuthOptions | undefined;

// Built on first use so that nothing touches the database at build time.
export function getAuthOptions(): NextAuthOptions {
  if (cached) return cached;
  const { sequelize, models } = getDb();
  cached = {
    secret: serverEnv().NEXTAUTH_SECRET,
    session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
    adapter: SequelizeAdapter(sequelize, {
      synchronize: false,
      models: {
        User: models.User as never,
        Account: models.Account as never,
        Session: models.Session as never,
        VerificationToken: models.VerificationToken as never,
      },
    }),
    pages: { signIn: '/sign-in', verifyRequest: '/sign-in/check-email', error: '/sign-in' },
    providers: [
      CredentialsProvider({
        id: 'password',
        name: 'E-mail and password',
        credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
        async authorize(credentials, req) {
          const address = getClientAddress(new Headers((req?.headers ?? {}) as Record<string, string>));
          return checkPasswordSignIn(String(credentials?.email ?? ''), String(credentials?.password ?? ''), address);
        },
      }),
      CredentialsProvider({
        id: 'invitation',
        name: 'Staff invitation',
        credentials: { token: { label: 'Invitation', type: 'text' }, name: { label: 'Name', type: 'text' } },
        async authorize(credentials) {
          const user = await acceptInvitation(String(credentials?.token ?? ''), credentials?.name);
          return user ? { id: user.id, email: user.email, name: user.name } : null;
        },
      }),
      CredentialsProvider({
        id: 'address-proof',
        name: 'Address confirmation',
        credentials: { token: { label: 'Link', type: 'text' }, password: { label: 'Password', type: 'password' } },
        async authorize(credentials) {
          return proveAddress(String(credentials?.token ?? ''), String(credentials?.password ?? ''));
        },
      }),
      EmailProvider({
        server: serverEnv().SMTP_URL,
        from: serverEnv().MAIL_FROM,
        maxAge: 30 * 60,
        async sendVerificationRequest({ identifier, url }) {
          // Past the limit nothing is sent, and the answer stays the same (no hint to a stranger).
          const perAddress = await recordAttempt(`link:${identifier.toLowerCase()}`, {
            limit: LINKS_PER_ADDRESS_PER_HOUR,
            windowS: 3600,
          });
          if (!perAddress.allowed) return;
          // A suspended account gets no link; the answer is the same as for anyone (the refusal
          // itself happens where a link is used, in the signIn callback).
          const target = await models.User.findOne({
            where: { email: identifier.toLowerCase() },
            attributes: ['suspendedAt'],
          });
          if (target?.suspendedAt) return;
          await sendMail(
            linkMail({
              to: identifier,
              subject: 'Your Boreline sign-in link',
              intro: 'Someone (we hope you) asked to sign in to Boreline with this address.',
              linkLabel: 'Sign in to Boreline',
              url,
              outro: 'The link works once and expires in 30 minutes. If you did not ask for it, ignore this message.',
            }),
          );
        },
      }),
    ],
    events: {
      // Signing out ends every session of the person, not only this browser's cookie.
      async signOut({ token }) {
        if (typeof token?.uid === 'string') await endAllSessions(token.uid);
      },
    },
    callbacks: {
      // Every way in (password, e-mailed link, invitation) ends here: a suspended account is refused,
      // only after the password (if any) was right, so the answer tells a stranger nothing.
      async signIn({ user, account, email }) {
        if (!user?.email) return true;
        // Asking for an e-mailed link proves nothing yet: the same answer for every address.
        if (email?.verificationRequest) return true;
        const found = await models.User.findOne({
          where: { email: user.email.toLowerCase() },
          attributes: ['suspendedAt'],
        });
        // Absolute: next-auth's client reads the error with new URL(), which needs one.
        if (found?.suspendedAt) return new URL('/sign-in?error=AccountSuspended', appUrl()).toString();
        // Following an e-mailed link proves the mailbox. On an account whose address was never
        // proven, a password was chosen by whoever signed up, perhaps not the mailbox's owner: it
        // goes, with every session it opened (the adapter then marks the address proven).
        if (account?.provider === 'email' && !email?.verificationRequest) await wipeUnprovenPassword(user.email);
        return true;
      },
      async jwt({ token, user }) {
        if (user) {
          // Each session carries the person's session version; raising it ends every session.
          const [row] = await sequelize.query<{ v: number }>('select session_version as v from users where id = :id', {
            replacements: { id: user.id },
            type: QueryTypes.SELECT,
          });
          token.uid = user.id;
          token.sv = row?.v ?? 0;
        } else if (typeof token.uid === 'string') {
          // Reading the session (GET /api/auth/session): an ended or suspended session is refused;
          // next-auth then answers an empty session and clears the cookie. A database that does not answer
          // ends nothing (the cookie stays; every request still checks the person when it can): the phone's
          // service worker asks this while the connection comes back, and an outage must not sign people out.
          let live: unknown;
          try {
            [live] = await sequelize.query(
              'select 1 from users where id = :id and session_version = :sv and suspended_at is null',
              {
                replacements: { id: token.uid, sv: typeof token.sv === 'number' ? token.sv : 0 },
                type: QueryTypes.SELECT,
              },
            );
          } catch (err) {
            if (isDatabaseDown(err)) return token;
            throw err;
          }
          if (!live) throw new Error('SessionEnded');
        }
        return token;
      },
      async redirect({ url, baseUrl }) {
        return new URL(safeRedirectPath(url, baseUrl, '/home'), baseUrl).toString();
      },
      async session({ session, token }) {
        if (session.user && typeof token.uid === 'string') session.user.id = token.uid;
        return session;
      },
    },
  };
  return cached;
}
