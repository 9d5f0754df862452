import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import EmailProvider from 'next-auth/providers/email';
import { AppError } from '@/lib/errors';
import { findUserByEmail } from '@/db/repositories/users';
import { getDb } from '../db';
import { getEnv } from '../env';
import { sendMail } from '../mail/mailer';
import { signInLinkMail } from '../mail/templates';
import { verifyCredentials } from '../services/accounts';
import { kyselyAdapter, type EpicycleAdapterUser } from './kysely-adapter';
import type { SessionClaims } from './session';

/** Sessions last 30 days unless the session version moves on. */
const SESSION_MAX_AGE_S = 30 * 24 * 60 * 60;
/** Sign-in links are good for one day. */
const SIGN_IN_LINK_MAX_AGE_S = 24 * 60 * 60;

function clientIp(headers: Record<string, string | string[] | undefined> | undefined): string {
  const forwarded = headers?.['x-forwarded-for'];
  const first = (Array.isArray(forwarded) ? forwarded[0] : forwarded)?.split(',')[0]?.trim();
  const real = headers?.['x-real-ip'];
  return first || (Array.isArray(real) ? real[0] : real) || 'local';
}

/** next-auth, configured once: password and e-mail-link sign-in, JWT sessions holding only id and version. */
export function getAuthOptions(): NextAuthOptions {
  const env = getEnv();
  const db = getDb();
  return {
    secret: env.AUTH_SECRET,
    adapter: kyselyAdapter(db),
    // With an adapter the default becomes database sessions, under which password users would look signed out.
    session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_S },
    useSecureCookies: env.APP_URL.startsWith('https://'),
    pages: { signIn: '/sign-in', verifyRequest: '/check-email', error: '/sign-in' },
    providers: [
      CredentialsProvider({
        id: 'credentials',
        name: 'E-mail and password',
        credentials: { email: { type: 'email' }, password: { type: 'password' } },
        async authorize(credentials, req) {
          const email = String(credentials?.email ?? '');
          const password = String(credentials?.password ?? '');
          try {
            const user = await verifyCredentials(db, email, password, clientIp(req?.headers));
            return { id: user.id, email: user.email, name: user.name, sessionVersion: user.sessionVersion } as EpicycleAdapterUser;
          } catch (error) {
            // next-auth passes a thrown message to the client as `error`; the form shows it.
            if (error instanceof AppError) throw new Error(error.message);
            throw error;
          }
        },
      }),
      EmailProvider({
        server: env.SMTP_URL,
        from: env.MAIL_FROM,
        maxAge: SIGN_IN_LINK_MAX_AGE_S,
        // Only existing accounts get a link; an unknown address sees the same page and nothing is created.
        async sendVerificationRequest({ identifier, url }) {
          const user = await findUserByEmail(db, identifier);
          if (!user) return;
          await sendMail(signInLinkMail({ to: user.email, url }));
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user }) {
        if (user) {
          const u = user as EpicycleAdapterUser;
          return { uid: u.id, sv: u.sessionVersion } satisfies SessionClaims;
        }
        return { uid: token.uid, sv: token.sv };
      },
      async session({ session, token }) {
        return { expires: session.expires, user: { id: token.uid as string } } as typeof session;
      },
    },
  };
}
