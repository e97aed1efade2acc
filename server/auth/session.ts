/**
 * Who is asking: the signed-in user behind the next-auth JWT cookie, re-read from the database on
 * every request so that a deactivated member, a changed role, a bumped session epoch (password
 * change, deactivation) or a signed-out session (its id revoked) takes effect at once rather than
 * when the token expires.
 */
import { cache } from 'react';
import { cookies, headers } from 'next/headers';
import { forbidden, redirect } from 'next/navigation';
import { decode } from 'next-auth/jwt';
import { findSessionRow } from '@/db/queries/members';
import { can, isRole, type Permission, type Role } from '@/lib/auth/permissions';
import { SESSION_MAX_AGE_S, sessionCookieName } from './cookies';
import { isSafeLocalPath } from '@/server/http/localPath';

export interface SessionUser {
  id: string;
  teamId: string;
  teamName: string;
  role: Role;
  name: string;
  email: string;
  unitSystem: 'si' | 'imperial';
  /** The separator the user chose, or null: then the browser's locale decides (lib/units/parse). */
  decimalSeparator: '.' | ',' | null;
  /** ISO 4217 code of the team's money, shown with every amount. */
  teamCurrency: string;
}

/** The claims Ampwarden puts in the next-auth JWT (see server/auth/options.ts). */
export interface SessionClaims {
  sub: string;
  teamId: string;
  role: Role;
  epoch: number;
  /** This session's own id, so that signing out can end it alone (revoked_sessions). */
  sid?: string;
  /** When the member signed in (Unix seconds): a session lasts SESSION_MAX_AGE_S from then, however often it is refreshed. */
  authAt?: number;
}

const SESSION_ID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function readClaims(token: Record<string, unknown> | null): SessionClaims | null {
  if (!token) return null;
  const { sub, teamId, role, epoch, sid, authAt } = token;
  if (typeof sub !== 'string' || typeof teamId !== 'string' || !isRole(role) || typeof epoch !== 'number') return null;
  if (sid !== undefined && (typeof sid !== 'string' || !SESSION_ID_PATTERN.test(sid))) return null;
  if (authAt !== undefined && (typeof authAt !== 'number' || !Number.isFinite(authAt))) return null;
  return { sub, teamId, role, epoch, ...(sid !== undefined ? { sid } : {}), ...(authAt !== undefined ? { authAt } : {}) };
}

/** When a session ends at the latest: SESSION_MAX_AGE_S after sign-in (or from now, for a session that does not say). */
export function sessionEndsAt(claims: Pick<SessionClaims, 'authAt'>, nowMs = Date.now()): Date {
  const fromS = claims.authAt ?? Math.floor(nowMs / 1000);
  return new Date((fromS + SESSION_MAX_AGE_S) * 1000);
}

/** Checks the claims against the user's current row; null when the session no longer holds. */
export async function resolveSessionUser(claims: SessionClaims | null): Promise<SessionUser | null> {
  if (!claims) return null;
  if (claims.authAt !== undefined && sessionEndsAt(claims).getTime() <= Date.now()) return null;
  const row = await findSessionRow(claims.sub, claims.sid);
  if (!row || !row.active || row.revoked || row.sessionEpoch !== claims.epoch || row.teamId !== claims.teamId) return null;
  return {
    id: row.id,
    teamId: row.teamId,
    teamName: row.teamName,
    // The role comes from the row, not the token: a role change applies to the next request.
    role: row.role,
    name: row.name,
    email: row.email,
    unitSystem: row.unitSystem,
    decimalSeparator: row.decimalSeparator ?? null,
    teamCurrency: row.teamCurrency,
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
