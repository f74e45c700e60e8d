import { readdirSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { join } from 'node:path';
import type { Knex } from 'knex';
import type { Db } from './knex';

const MIGRATIONS_DIR = fileURLToPath(new URL('../../migrations/', import.meta.url));
const NAME = /^\d{14}_[a-z0-9_-]+\.ts$/;

interface MigrationModule {
  up(knex: Knex): Promise<void>;
  down?(knex: Knex): Promise<void>;
}

/**
 * Loads every `migrations/NNNNNNNNNNNNNN_name.ts` through the running module loader (tsx or Vitest),
 * so TypeScript migrations work without a build and any engineer can add a file without a list to edit.
 */
class DirectorySource implements Knex.MigrationSource<string> {
  async getMigrations(): Promise<string[]> {
    return readdirSync(MIGRATIONS_DIR).filter((f) => NAME.test(f)).sort();
  }
  getMigrationName(name: string): string {
    return name;
  }
  async getMigration(name: string): Promise<Knex.Migration> {
    const mod = (await import(pathToFileURL(join(MIGRATIONS_DIR, name)).href)) as MigrationModule;
    return { up: mod.up, down: mod.down ?? (async () => undefined) };
  }
}

/** Brings the schema up to date; returns the names of the migrations that ran. */
export async function migrateLatest(db: Db): Promise<string[]> {
  // Several servers starting at once on one PostgreSQL: one migrates, the others find Knex's migration
  // lock taken and wait for it, then find nothing left to do.
  for (let attempt = 0; ; attempt++) {
    try {
      const [, ran] = (await db.migrate.latest({ migrationSource: new DirectorySource() })) as [number, string[]];
      return ran;
    } catch (err) {
      // (on an empty database two may also race to create the migration tables themselves)
      if (attempt >= 120 || !/already locked|already exists|duplicate key/i.test(String((err as Error).message))) throw err;
      await new Promise((r) => setTimeout(r, 500));
    }
  }
}
