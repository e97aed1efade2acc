import { defineConfig } from 'vitest/config';
import path from 'node:path';

// Three projects: `unit` runs pure library tests and the layer rule's import scan (no database);
// `integration` runs against the real PostgreSQL server started by scripts/test.sh (DATABASE_URL
// points at a throw-away database); `e2e` against the production build.
export default defineConfig({
  resolve: { alias: { '@': path.resolve(import.meta.dirname) } },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['tests/lib/**/*.test.ts', 'tests/architecture/**/*.test.ts'],
          environment: 'node',
          // Property tests run thousands of solves; a loaded 2-core machine must not turn them into timeouts.
          testTimeout: 120_000,
        },
      },
      {
        extends: true,
        test: {
          // Against the production build that scripts/test.sh serves at APP_URL, in Debian's Chromium.
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 120_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 180_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
