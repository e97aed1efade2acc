/**
 * Team API tokens: admins create and revoke them; the calculation API looks them up by hash.
 * Only the SHA-256 hash of a token is ever written (server/apiTokens/tokens.ts makes both).
 */
import { and, desc, eq, sql } from 'drizzle-orm';
import { getDb, getPool, type Executor } from '../client';
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
}

/** The token's request count in its current one-minute window, after this request was counted. */
export interface TokenWindowCount {
  requests: number;
  /** When the window ends, and the database's clock when it counted (ms since the epoch). */
  windowEndsAtMs: number;
  countedAtMs: number;
}

export type TokenRequestAuthorisation =
  | { state: 'active'; principal: TokenPrincipal; window: TokenWindowCount }
  | { state: 'missing_scope'; principal: TokenPrincipal }
  | { state: 'revoked' | 'expired' | 'unknown' };

/** The length of a token's counting window: its rate is requests per minute. */
export const TOKEN_WINDOW_MS = 60_000;

/** Last use is stamped at most once a minute per token, so that busy integrations do not write on every call. */
export const LAST_USED_RESOLUTION_MS = 60_000;

/** The key of a token's row in api_token_limits (the layout rate-limiter-flexible's store uses). */
const WINDOW_KEY_PREFIX = 'apitoken:';

interface AuthorisationRow {
  id: string;
  team_id: string;
  name: string;
  scopes: string[];
  requests_per_minute: number;
  revoked: boolean;
  expired: boolean;
  has_scope: boolean;
  requests: number | null;
  window_ends_at_ms: string | null;
  counted_at_ms: string;
}

/** $1 the token's hash, $2 the scope asked for (see authoriseTokenRequest). */
const AUTHORISE_SQL = `
  with clock as (
    select (extract(epoch from clock_timestamp()) * 1000)::bigint as now_ms
  ), token as (
    select t.id, t.team_id, t.name, t.scopes, t.requests_per_minute, t.last_used_at,
           t.revoked_at is not null as revoked,
           t.revoked_at is null and t.expires_at is not null and t.expires_at <= now() as expired,
           $2::text = any(t.scopes) as has_scope
      from api_tokens t
     where t.token_hash = $1::text
     limit 1
  ), counted as (
    insert into api_token_limits as w (key, points, expire)
    select '${WINDOW_KEY_PREFIX}' || token.id::text, 1, clock.now_ms + ${TOKEN_WINDOW_MS}
      from token, clock
     where not token.revoked and not token.expired and token.has_scope
    on conflict (key) do update set
      points = case when w.expire is null or w.expire <= excluded.expire - ${TOKEN_WINDOW_MS} then 1 else w.points + 1 end,
      expire = case when w.expire is null or w.expire <= excluded.expire - ${TOKEN_WINDOW_MS} then excluded.expire else w.expire end
    returning w.points, w.expire
  ), touched as (
    update api_tokens t set last_used_at = now()
      from token
     where t.id = token.id and exists (select 1 from counted)
       and (token.last_used_at is null or token.last_used_at < now() - interval '${LAST_USED_RESOLUTION_MS} milliseconds')
    returning t.id
  )
  select token.id, token.team_id, token.name, token.scopes, token.requests_per_minute,
         token.revoked, token.expired, token.has_scope,
         counted.points as requests, counted.expire as window_ends_at_ms, clock.now_ms as counted_at_ms
    from token cross join clock left join counted on true`;

/**
 * One request to the calculation API, authorised in ONE round trip: the token found by its hash
 * (not team-scoped by design — the hash IS the credential that names the team), its state
 * (revoked, expired), its scope, and — only for an active token with the scope — the request
 * counted in the token's fixed one-minute window (api_token_limits, shared by every app instance)
 * and last use stamped when older than a minute. Revocation takes effect on the next request.
 *
 * Why not two statements (lookup, then rate-limiter-flexible's consume): each round trip costs the
 * single-threaded server about as much as the calculation itself; this keeps the same table, the
 * same fixed-window rule (a window starts at the first request after the last one ended) and the
 * same immediacy. All times come from the database's clock, one clock for every instance.
 */
export async function authoriseTokenRequest(tokenHash: string, scope: ApiTokenScope): Promise<TokenRequestAuthorisation> {
  // A named statement: each pooled connection parses and plans it once, not on every request.
  const result = await getPool().query<AuthorisationRow>({ name: 'ampwarden_authorise_token_request', text: AUTHORISE_SQL, values: [tokenHash, scope] });
  const row = result.rows[0];
  if (!row) return { state: 'unknown' };
  if (row.revoked) return { state: 'revoked' };
  if (row.expired) return { state: 'expired' };
  const principal: TokenPrincipal = { tokenId: row.id, teamId: row.team_id, name: row.name, scopes: asScopes(row.scopes), requestsPerMinute: row.requests_per_minute };
  if (!row.has_scope || row.requests === null || row.window_ends_at_ms === null) return { state: 'missing_scope', principal };
  return {
    state: 'active',
    principal,
    window: { requests: row.requests, windowEndsAtMs: Number(row.window_ends_at_ms), countedAtMs: Number(row.counted_at_ms) },
  };
}
