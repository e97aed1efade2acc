// Applies the committed SQL migrations in drizzle/ to DATABASE_URL (idempotent).
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { closeDb, getDb } from '../db/client';

async function main() {
  const started = Date.now();
  await migrate(getDb(), { migrationsFolder: 'drizzle' });
  console.log(`ampwarden: migrations applied in ${Date.now() - started} ms`);
}

main()
  .catch((error: unknown) => {
    console.error(`ampwarden: migration failed: ${error instanceof Error ? error.message : String(error)}`);
    process.exitCode = 1;
  })
  .finally(() => closeDb());
