/**
 * Who is asking: the signed-in user behind the next-auth JWT cookie, re-read from the database on
 * every request so that a deactivated member, a changed role or a bumped session epoch (password
 * change, deactivation) takes effect at once rather than when the token expires.
 */
import { cache } from 'react';
import { cookies, headers } from 'next/headers';
import { forbidden, redirect } from 'next/navigation';
import { decode } from 'next-auth/jwt';
import { findSessionRow } from '@/db/queries/members';
import { can, isRole, type Permission, type Role } from '@/lib/auth/permissions';
import { sessionCookieName } from './cookies';
import { isSafeLocalPath } from '@/server/http/localPath';

export interface SessionUser {
  id: string;
  teamId: string;
  teamName: string;
  role: Role;
  name: string;
  email: string;
  unitSystem: 'si' | 'imperial';
}

/** The claims Ampwarden puts in the next-auth JWT (see server/auth/options.ts). */
export interface SessionClaims {
  sub: string;
  teamId: string;
  role: Role;
  epoch: number;
}

export function readClaims(token: Record<string, unknown> | null): SessionClaims | null {
  if (!token) return null;
  const { sub, teamId, role, epoch } = token;
  if (typeof sub !== 'string' || typeof teamId !== 'string' || !isRole(role) || typeof epoch !== 'number') return null;
  return { sub, teamId, role, epoch };
}

/** Checks the claims against the user's current row; null when the session no longer holds. */
export async function resolveSessionUser(claims: SessionClaims | null): Promise<SessionUser | null> {
  if (!claims) return null;
  const row = await findSessionRow(claims.sub);
  if (!row || !row.active || row.sessionEpoch !== claims.epoch || row.teamId !== claims.teamId) return null;
  return {
    id: row.id,
    teamId: row.teamId,
    teamName: row.teamName,
    // The role comes from the row, not the token: a role change applies to the next request.
    role: row.role,
    name: row.name,
    email: row.email,
    unitSystem: row.unitSystem,
  };
}

async function decodeSessionCookie(raw: string | undefined): Promise<SessionClaims | null> {
  const secret = process.env.NEXTAUTH_SECRET;
  if (!raw || !secret) return null;
  try {
    return readClaims((await decode({ token: raw, secret })) as Record<string, unknown> | null);
  } catch {
    // A token from another secret or a tampered one is simply no session.
    return null;
  }
}

/** The signed-in user of this request, or null. Cached per request (React cache). */
export const getSessionUser = cache(async (): Promise<SessionUser | null> => {
  const jar = await cookies();
  return resolveSessionUser(await decodeSessionCookie(jar.get(sessionCookieName())?.value));
});

/**
 * For page data loads: anonymous visitors go to /sign-in (and come back afterwards); a signed-in
 * user without the permission gets the 403 page (app/forbidden.tsx).
 */
export async function requirePageUser(permission?: Permission): Promise<SessionUser> {
  const user = await getSessionUser();
  if (!user) {
    const back = (await headers()).get('x-ampwarden-path');
    redirect(isSafeLocalPath(back) ? `/sign-in?next=${encodeURIComponent(back)}` : '/sign-in');
  }
  if (permission && !can(user.role, permission)) forbidden();
  return user;
}
