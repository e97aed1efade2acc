import Link from 'next/link';
import { listApiTokens } from '@/db/queries/apiTokens';
import { DEFAULT_REQUESTS_PER_MINUTE, MAX_REQUESTS_PER_MINUTE } from '@/lib/api/limits';
import { requirePageUser } from '@/server/auth/session';
import { TokensAdmin } from './TokensAdmin';

export const metadata = { title: 'API tokens' };
export const dynamic = 'force-dynamic';

export default async function ApiTokensPage() {
  const user = await requirePageUser('apitoken:manage');
  const tokens = await listApiTokens(user.teamId);
  return (
    <section aria-labelledby="tokens-heading" className="max-w-5xl">
      <h1 id="tokens-heading" className="text-title">
        API tokens of {user.teamName}
      </h1>
      <p className="mt-2 text-ink-600">
        A token lets a program of your team call the calculation API (see{' '}
        <Link href="/api-docs" className="text-copper-700 underline">
          the API guide
        </Link>
        ). Give each program its own token, with only the scopes it needs, and revoke a token as soon as it is no longer used or may have leaked.
      </p>
      <TokensAdmin
        defaultRate={DEFAULT_REQUESTS_PER_MINUTE}
        maxRate={MAX_REQUESTS_PER_MINUTE}
        tokens={tokens.map((t) => ({
          id: t.id,
          name: t.name,
          prefix: t.prefix,
          scopes: t.scopes,
          requestsPerMinute: t.requestsPerMinute,
          createdByName: t.createdByName,
          createdAt: t.createdAt.toISOString(),
          expiresAt: t.expiresAt?.toISOString() ?? null,
          lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
          revokedAt: t.revokedAt?.toISOString() ?? null,
        }))}
      />
    </section>
  );
}
