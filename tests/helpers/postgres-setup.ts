import type { TestProject } from 'vitest/node';
import { backingServicesMissing, startPostgres } from './backing-services';

/**
 * Vitest global setup of the `api-postgres` project: one PostgreSQL server for the run (each test
 * app makes its own database on it, tests/helpers/test-database.ts), stopped by pid afterwards.
 */
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const missing = backingServicesMissing();
  if (missing) throw new Error(`the API suite on PostgreSQL cannot run: ${missing}`);
  const pg = await startPostgres();
  project.provide('pgServerUrl', pg.serverUrl);
  return () => pg.stop();
}
