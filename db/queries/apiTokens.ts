/**
 * Team API tokens: admins create and revoke them; the calculation API looks them up by hash.
 * Only the SHA-256 hash of a token is ever written (server/apiTokens/tokens.ts makes both).
 */
import { and, desc, eq, isNull, lt, or, sql } from 'drizzle-orm';
import { getDb, type Executor } from '../client';
import { apiTokens, users } from '../schema';
import { recordAudit } from './audit';

export const API_TOKEN_SCOPES = ['read', 'calc'] as const;
export type ApiTokenScope = (typeof API_TOKEN_SCOPES)[number];

export interface ApiTokenListItem {
  id: string;
  name: string;
  prefix: string;
  scopes: ApiTokenScope[];
  requestsPerMinute: number;
  createdAt: Date;
  createdByName: string | null;
  expiresAt: Date | null;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}

function asScopes(raw: string[]): ApiTokenScope[] {
  return raw.filter((scope): scope is ApiTokenScope => (API_TOKEN_SCOPES as readonly string[]).includes(scope));
}

/** The team's tokens, newest first (active and revoked; never the hash). */
export async function listApiTokens(teamId: string, db: Executor = getDb()): Promise<ApiTokenListItem[]> {
  const rows = await db
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      prefix: apiTokens.prefix,
      scopes: apiTokens.scopes,
      requestsPerMinute: apiTokens.requestsPerMinute,
      createdAt: apiTokens.createdAt,
      createdByName: users.name,
      expiresAt: apiTokens.expiresAt,
      lastUsedAt: apiTokens.lastUsedAt,
      revokedAt: apiTokens.revokedAt,
    })
    .from(apiTokens)
    .leftJoin(users, eq(users.id, apiTokens.createdBy))
    .where(eq(apiTokens.teamId, teamId))
    .orderBy(desc(apiTokens.createdAt));
  return rows.map((row) => ({ ...row, scopes: asScopes(row.scopes) }));
}

export interface NewApiToken {
  name: string;
  scopes: ApiTokenScope[];
  requestsPerMinute: number;
  expiresAt: Date | null;
  tokenHash: string;
  prefix: string;
}

/** Stores a new token (its hash) and the audit entry in one transaction. */
export async function insertApiToken(teamId: string, actorId: string | null, token: NewApiToken): Promise<{ id: string }> {
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .insert(apiTokens)
      .values({ teamId, createdBy: actorId, ...token })
      .returning({ id: apiTokens.id });
    await recordAudit(tx, {
      teamId,
      actorId,
      action: 'apitoken.create',
      entity: 'api_token',
      entityId: row.id,
      detail: { name: token.name, scopes: token.scopes, requestsPerMinute: token.requestsPerMinute, prefix: token.prefix },
    });
    return row;
  });
}

/**
 * Revokes a token of this team. Returns false when the team has no such token (another team's
 * token is "not found", never "forbidden"); revoking twice is harmless and keeps the first time.
 */
export async function revokeApiToken(teamId: string, actorId: string | null, tokenId: string): Promise<boolean> {
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(tokenId)) return false;
  return getDb().transaction(async (tx) => {
    const [existing] = await tx
      .select({ id: apiTokens.id, revokedAt: apiTokens.revokedAt, name: apiTokens.name })
      .from(apiTokens)
      .where(and(eq(apiTokens.teamId, teamId), eq(apiTokens.id, tokenId)))
      .for('update');
    if (!existing) return false;
    if (existing.revokedAt) return true;
    await tx
      .update(apiTokens)
      .set({ revokedAt: sql`now()`, revokedBy: actorId })
      .where(and(eq(apiTokens.teamId, teamId), eq(apiTokens.id, tokenId)));
    await recordAudit(tx, { teamId, actorId, action: 'apitoken.revoke', entity: 'api_token', entityId: tokenId, detail: { name: existing.name } });
    return true;
  });
}

export interface TokenPrincipal {
  tokenId: string;
  teamId: string;
  name: string;
  scopes: ApiTokenScope[];
  requestsPerMinute: number;
  lastUsedAt: Date | null;
}

export type TokenLookup = { state: 'active'; principal: TokenPrincipal } | { state: 'revoked' | 'expired' | 'unknown' };

/**
 * The token with this hash, as the API sees it. Not team-scoped by design: the hash IS the
 * credential that names the team.
 */
export async function findTokenByHash(tokenHash: string): Promise<TokenLookup> {
  const [row] = await getDb()
    .select({
      id: apiTokens.id,
      teamId: apiTokens.teamId,
      name: apiTokens.name,
      scopes: apiTokens.scopes,
      requestsPerMinute: apiTokens.requestsPerMinute,
      expiresAt: apiTokens.expiresAt,
      revokedAt: apiTokens.revokedAt,
      lastUsedAt: apiTokens.lastUsedAt,
    })
    .from(apiTokens)
    .where(eq(apiTokens.tokenHash, tokenHash))
    .limit(1);
  if (!row) return { state: 'unknown' };
  if (row.revokedAt) return { state: 'revoked' };
  if (row.expiresAt && row.expiresAt.getTime() <= Date.now()) return { state: 'expired' };
  return {
    state: 'active',
    principal: { tokenId: row.id, teamId: row.teamId, name: row.name, scopes: asScopes(row.scopes), requestsPerMinute: row.requestsPerMinute, lastUsedAt: row.lastUsedAt },
  };
}

/** Last use is stamped at most once a minute per token, so that busy integrations do not write on every call. */
export const LAST_USED_RESOLUTION_MS = 60_000;

/** Stamps last use (the WHERE keeps concurrent requests from all writing). */
export async function touchApiToken(tokenId: string): Promise<void> {
  await getDb()
    .update(apiTokens)
    .set({ lastUsedAt: sql`now()` })
    .where(and(eq(apiTokens.id, tokenId), or(isNull(apiTokens.lastUsedAt), lt(apiTokens.lastUsedAt, sql`now() - interval '1 minute'`))));
}
