import { defineConfig } from 'vitest/config';
import { backingServicesMissing } from './tests/helpers/backing-services';

const every = ['shared/**/*.test.ts', 'server/**/*.test.ts', 'src/**/*.test.ts', 'tests/**/*.test.ts'];

// The API suite runs a second time on PostgreSQL (Debian's; npm test installs it as root). Without
// it, or with GATEFOLD_PG_TESTS=0 (a quick local run of one API file), that second run is left out.
const missing = process.env.GATEFOLD_PG_TESTS === '0' ? 'GATEFOLD_PG_TESTS=0' : backingServicesMissing();
if (missing) console.warn(`skipping the API suite on PostgreSQL: ${missing}`);

export default defineConfig({
  test: {
    exclude: ['node_modules', 'dist', 'tests/e2e/**'],
    testTimeout: 30000,
    hookTimeout: 30000,
    pool: 'forks',
    // Two test files at a time, even on 2 cores (Vitest's default there is one): most files spend their
    // time waiting on sockets, child processes, PostgreSQL and timers, not on the CPU, so two overlap
    // well. Each file still runs in its own fork; `vitest run --maxWorkers=1` runs them one by one.
    maxWorkers: 2,
    projects: [
      // every test on SQLite; tests/multi-server starts its own PostgreSQL and Redis (or skips, saying why)
      { extends: true, test: { name: 'main', include: every } },
      // the API suite again, each test app on its own PostgreSQL database (DATABASE_URL)
      ...(missing ? [] : [{ extends: true as const, test: { name: 'api-postgres', include: ['tests/api/**/*.test.ts'], globalSetup: ['tests/helpers/postgres-setup.ts'] } }]),
    ],
  },
});
