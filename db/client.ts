import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { Pool } from 'pg';
import * as schema from './schema';

export type Db = NodePgDatabase<typeof schema>;
/** A transaction handle or the database itself: query functions accept either. */
export type Executor = Db | Parameters<Parameters<Db['transaction']>[0]>[0];

// One pool per process; kept on globalThis so that dev-server reloads do not leak pools.
const holder = globalThis as unknown as { ampwardenPool?: Pool; ampwardenDb?: Db };

export class DatabaseConfigError extends Error {}

export function getPool(): Pool {
  if (!holder.ampwardenPool) {
    const connectionString = process.env.DATABASE_URL;
    if (!connectionString) {
      throw new DatabaseConfigError('DATABASE_URL is not set: start the app with `npm start`');
    }
    holder.ampwardenPool = new Pool({
      connectionString,
      max: Number(process.env.DATABASE_POOL_MAX ?? 10),
      // Fail fast when the server is down so that requests answer 503 instead of hanging.
      connectionTimeoutMillis: 3000,
      idleTimeoutMillis: 30_000,
    });
    // An idle client losing its server must not crash the process; the next query reconnects.
    holder.ampwardenPool.on('error', () => {});
    // Same for a checked-out client whose server goes away mid-query: the query itself rejects,
    // and an unhandled 'error' event must not take the whole process down with it.
    holder.ampwardenPool.on('connect', (client) => client.on('error', () => {}));
  }
  return holder.ampwardenPool;
}

export function getDb(): Db {
  holder.ampwardenDb ??= drizzle(getPool(), { schema });
  return holder.ampwardenDb;
}

export async function closeDb(): Promise<void> {
  const pool = holder.ampwardenPool;
  holder.ampwardenPool = undefined;
  holder.ampwardenDb = undefined;
  await pool?.end();
}
