import { sql } from 'drizzle-orm';
import { getDb } from '../client';

/** One round trip to PostgreSQL; returns its duration in milliseconds. */
export async function measureDatabaseRoundTrip(): Promise<{ roundTripMs: number; serverVersion: string }> {
  const started = performance.now();
  const rows = await getDb().execute<{ server_version: string }>(sql`select current_setting('server_version') as server_version`);
  const roundTripMs = performance.now() - started;
  return { roundTripMs, serverVersion: rows.rows[0]?.server_version ?? 'unknown' };
}
