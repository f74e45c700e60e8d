import { defineConfig } from 'vitest/config';

const every = ['shared/**/*.test.ts', 'server/**/*.test.ts', 'src/**/*.test.ts', 'tests/**/*.test.ts'];

export default defineConfig({
  test: {
    exclude: ['node_modules', 'dist', 'tests/e2e/**'],
    testTimeout: 30000,
    hookTimeout: 30000,
    pool: 'forks',
    projects: [
      // every test on SQLite; tests/multi-server starts its own PostgreSQL and Redis
      { extends: true, test: { name: 'main', include: every } },
      // the API suite again, each test app on its own PostgreSQL database (DATABASE_URL)
      { extends: true, test: { name: 'api-postgres', include: ['tests/api/**/*.test.ts'], globalSetup: ['tests/helpers/postgres-setup.ts'] } },
    ],
  },
});
