/**
 * The first, coarse gate: pages answer 503 "Database unavailable" while PostgreSQL cannot be
 * reached (server/http/databaseGate.ts); anonymous visitors of workspace pages go to /sign-in,
 * signed-in visitors of the landing page go to /projects. It only reads the session cookie; the real checks
 * (active member, session epoch, role, team) happen on the server in every page data load, route
 * handler and server action (server/auth/session.ts, server/http/api.ts, server/auth/actions.ts).
 */
import { NextResponse, type NextRequest } from 'next/server';
import { decode } from 'next-auth/jwt';
import { sessionCookieName } from '@/server/auth/cookies';
import { databaseReachable, databaseUnavailablePage } from '@/server/http/databaseGate';

/** Paths anyone may open: landing, sign-in and its helpers, share links, APIs (they answer 401 themselves). /dev/mailbox is for signed-in admins. */
const PUBLIC_PREFIXES = ['/sign-in', '/sign-out', '/invite/', '/reset', '/share/', '/api/'];

function isPublic(pathname: string): boolean {
  return pathname === '/' || PUBLIC_PREFIXES.some((prefix) => pathname === prefix.replace(/\/$/, '') || pathname.startsWith(prefix));
}

async function hasSessionToken(request: NextRequest): Promise<boolean> {
  const raw = request.cookies.get(sessionCookieName())?.value;
  const secret = process.env.NEXTAUTH_SECRET;
  if (!raw || !secret) return false;
  try {
    return Boolean((await decode({ token: raw, secret }))?.sub);
  } catch {
    return false;
  }
}

export async function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  // Pages (and the server actions posted to them) need the database; the API answers its own 503.
  if (pathname !== '/' && !pathname.startsWith('/api/') && !(await databaseReachable())) return databaseUnavailablePage();
  // Server actions answer 401/403 themselves (authorizeAction); a redirect would hide that status.
  if (request.headers.has('next-action')) return NextResponse.next();
  if (pathname === '/') {
    return (await hasSessionToken(request)) ? NextResponse.redirect(new URL('/projects', request.url)) : NextResponse.next();
  }
  if (isPublic(pathname)) return NextResponse.next();
  if (!(await hasSessionToken(request))) {
    const signIn = new URL('/sign-in', request.url);
    signIn.searchParams.set('next', `${pathname}${search}`);
    return NextResponse.redirect(signIn);
  }
  // Lets requirePageUser send a visitor whose session has ended back here after signing in.
  const headers = new Headers(request.headers);
  headers.set('x-ampwarden-path', `${pathname}${search}`);
  return NextResponse.next({ request: { headers } });
}

export const config = {
  matcher: ['/((?!_next/static|_next/image|favicon.ico|fonts/|.*\\.(?:png|svg|ico|woff2?|txt)$).*)'],
};
