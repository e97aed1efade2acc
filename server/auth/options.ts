/**
 * next-auth 4 configuration: e-mail + password (Credentials provider), JWT sessions carrying the
 * user id, team id, role, the user's session epoch, the session's own id and the sign-in time.
 * The token alone is never trusted for access: getSessionUser (session.ts) re-reads the user row
 * and the revoked sessions on every request. Signing out revokes the session's id, so that a copy
 * of the cookie taken before opens nothing afterwards.
 */
import { randomUUID } from 'node:crypto';
import type { NextAuthOptions } from 'next-auth';
import { endSession } from '@/db/queries/members';
import CredentialsProvider from 'next-auth/providers/credentials';
import { clientAddressFrom } from '@/server/limits/signIn';
import { isSafeLocalPath } from '@/server/http/localPath';
import { SESSION_MAX_AGE_S, sessionCookieName, usesSecureCookies } from './cookies';
import { LIMITED_PREFIX, verifySignIn } from './credentials';
import { readClaims, sessionEndsAt } from './session';

export function authOptions(): NextAuthOptions {
  const secure = usesSecureCookies();
  return {
    secret: process.env.NEXTAUTH_SECRET,
    session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_S },
    jwt: { maxAge: SESSION_MAX_AGE_S },
    useSecureCookies: secure,
    cookies: {
      sessionToken: {
        name: sessionCookieName(),
        options: { httpOnly: true, sameSite: 'lax', path: '/', secure },
      },
    },
    pages: { signIn: '/sign-in', error: '/sign-in', signOut: '/sign-out' },
    events: {
      // Awaited by next-auth before it clears the cookie; an error here is logged by next-auth (SIGNOUT_ERROR).
      async signOut({ token }) {
        const claims = readClaims(token as Record<string, unknown> | null);
        if (!claims) return;
        await endSession({ userId: claims.sub, epoch: claims.epoch, sessionId: claims.sid, expiresAt: sessionEndsAt(claims) });
      },
    },
    providers: [
      CredentialsProvider({
        id: 'credentials',
        name: 'E-mail and password',
        credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
        async authorize(credentials, req) {
          const outcome = await verifySignIn(credentials, clientAddressFrom(req?.headers ?? {}));
          if (outcome.ok) {
            const { id, teamId, role, name, email, sessionEpoch } = outcome.user;
            return { id, teamId, role, name, email, sessionEpoch };
          }
          // next-auth passes a thrown message to the sign-in page as ?error=…; null becomes CredentialsSignin.
          if (outcome.reason === 'limited') throw new Error(`${LIMITED_PREFIX}${outcome.retryAfterS}`);
          return null;
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user }) {
        if (user) {
          const signedIn = user as unknown as { id: string; teamId: string; role: string; sessionEpoch: number };
          token.sub = signedIn.id;
          token.teamId = signedIn.teamId;
          token.role = signedIn.role;
          token.epoch = signedIn.sessionEpoch;
          token.sid = randomUUID();
          token.authAt = Math.floor(Date.now() / 1000);
        } else if (typeof token.sid !== 'string') {
          // A cookie from before sessions had ids, refreshed: it gets one now, and its eight hours start now.
          token.sid = randomUUID();
          token.authAt = Math.floor(Date.now() / 1000);
        }
        return token;
      },
      async session({ session, token }) {
        // The browser copy carries only what the user menu needs; rights are checked on the server.
        return { ...session, user: { name: session.user?.name, email: session.user?.email }, role: token.role } as typeof session;
      },
      async redirect({ url, baseUrl }) {
        if (isSafeLocalPath(url)) return `${baseUrl}${url}`;
        try {
          return new URL(url).origin === new URL(baseUrl).origin ? url : `${baseUrl}/projects`;
        } catch {
          return `${baseUrl}/projects`;
        }
      },
    },
  };
}
