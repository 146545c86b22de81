import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import EmailProvider from 'next-auth/providers/email';
import SequelizeAdapter from '@next-auth/sequelize-adapter';
import bcrypt from 'bcryptjs';
import { getDb } from '@/lib/db';
import { sendMail, linkMail } from '@/lib/mail/send';
import { recordAttempt, clearAttempts } from './throttle';
import { acceptInvitation } from './invitations';

const SIGN_IN_LIMIT = Number(process.env.SIGN_IN_LIMIT_PER_15_MIN ?? 10);

let cached: NextAuthOptions | undefined;

// Built on first use so that nothing touches the database at build time.
export function getAuthOptions(): NextAuthOptions {
  if (cached) return cached;
  const { sequelize, models } = getDb();
  cached = {
    secret: process.env.NEXTAUTH_SECRET,
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
        async authorize(credentials) {
          const email = String(credentials?.email ?? '').trim().toLowerCase();
          const password = String(credentials?.password ?? '');
          if (!email || !password) return null;
          const throttle = await recordAttempt(`signin:${email}`, { limit: SIGN_IN_LIMIT, windowS: 15 * 60 });
          if (!throttle.allowed) throw new Error('TooManyAttempts');
          const user = await models.User.findOne({ where: { email } });
          if (!user?.passwordHash || !(await bcrypt.compare(password, user.passwordHash))) return null;
          await clearAttempts(`signin:${email}`);
          return { id: user.id, email: user.email, name: user.name };
        },
      }),
      CredentialsProvider({
        id: 'invitation',
        name: 'Staff invitation',
        credentials: { token: { label: 'Invitation', type: 'text' } },
        async authorize(credentials) {
          const user = await acceptInvitation(String(credentials?.token ?? ''));
          return user ? { id: user.id, email: user.email, name: user.name } : null;
        },
      }),
      EmailProvider({
        server: process.env.SMTP_URL ?? 'smtp://127.0.0.1:2525',
        from: process.env.MAIL_FROM ?? 'Boreline <no-reply@boreline.invalid>',
        maxAge: 30 * 60,
        async sendVerificationRequest({ identifier, url }) {
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
    callbacks: {
      // Every way in (password, e-mailed link, invitation) ends here: a suspended account is refused,
      // only after the password (if any) was right, so the answer tells a stranger nothing.
      async signIn({ user }) {
        if (!user?.email) return true;
        const found = await models.User.findOne({ where: { email: user.email.toLowerCase() }, attributes: ['suspendedAt'] });
        // Absolute: next-auth's client reads the error with new URL(), which needs one.
        return found?.suspendedAt ? new URL('/sign-in?error=AccountSuspended', process.env.NEXTAUTH_URL ?? 'http://localhost:3000').toString() : true;
      },
      async jwt({ token, user }) {
        if (user) token.uid = user.id;
        return token;
      },
      async session({ session, token }) {
        if (session.user && typeof token.uid === 'string') session.user.id = token.uid;
        return session;
      },
    },
  };
  return cached;
}
