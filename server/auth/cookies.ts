/**
 * The session cookie, named and flagged in one place so that next-auth (which writes it) and
 * getSessionUser (which reads it) agree. Secure and __Secure- prefixed when the app is served
 * over https (NEXTAUTH_URL); httpOnly and SameSite=Lax always.
 */
export function usesSecureCookies(): boolean {
  return (process.env.NEXTAUTH_URL ?? '').startsWith('https://');
}

export function sessionCookieName(): string {
  return `${usesSecureCookies() ? '__Secure-' : ''}next-auth.session-token`;
}

/** Eight hours: one working day; a deactivation or password change ends it sooner (sessionEpoch). */
export const SESSION_MAX_AGE_S = 8 * 60 * 60;
