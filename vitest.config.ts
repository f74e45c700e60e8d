import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['shared/**/*.test.ts', 'server/**/*.test.ts', 'src/**/*.test.ts', 'tests/unit/**/*.test.ts', 'tests/api/**/*.test.ts', 'tests/collab/**/*.test.ts', 'tests/sim/**/*.test.ts', 'tests/analysis/**/*.test.ts', 'tests/cli/**/*.test.ts', 'tests/snapshots/**/*.test.ts', 'tests/build/**/*.test.ts', 'tests/bringup/**/*.test.ts'],
    exclude: ['node_modules', 'dist', 'tests/e2e/**'],
    testTimeout: 30000,
    hookTimeout: 30000,
    pool: 'forks',
  },
});
