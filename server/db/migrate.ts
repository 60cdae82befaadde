import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Knex } from 'knex';
import type { FileStorage } from '../files/storage';
import { migrationsDir, seedsDir } from '../paths';

interface MigrationModule {
  up(knex: Knex): Promise<void>;
  down(knex: Knex): Promise<void>;
}

export interface SeedContext {
  /** Where demo files are written; seeds leave files out without it. */
  storage?: FileStorage;
}

interface SeedModule {
  seed(knex: Knex, context: SeedContext): Promise<void>;
}

const TS_MODULE = /^\d.*\.ts$/;

async function moduleFiles(dir: string): Promise<string[]> {
  return (await readdir(dir)).filter((name) => TS_MODULE.test(name)).sort();
}

/**
 * Loads migrations with this process's own module loader (tsx in the app, Vite's in tests)
 * instead of knex's, which cannot import TypeScript by itself.
 */
export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: () => moduleFiles(migrationsDir),
  getMigrationName: (name) => name,
  getMigration: async (name) =>
    (await import(pathToFileURL(path.join(migrationsDir, name)).href)) as MigrationModule,
};

export const MIGRATIONS_TABLE = 'knex_migrations';

export async function migrateToLatest(db: Knex): Promise<string[]> {
  const [, applied] = (await db.migrate.latest({
    migrationSource,
    tableName: MIGRATIONS_TABLE,
  })) as [number, string[]];
  return applied;
}

export async function rollbackAll(db: Knex): Promise<string[]> {
  const [, undone] = (await db.migrate.rollback(
    { migrationSource, tableName: MIGRATIONS_TABLE },
    true,
  )) as [number, string[]];
  return undone;
}

/** Runs every seed file in order; each seed decides for itself whether it has work to do. */
export async function runSeeds(db: Knex, context: SeedContext = {}): Promise<void> {
  for (const name of await moduleFiles(seedsDir)) {
    const seedModule = (await import(pathToFileURL(path.join(seedsDir, name)).href)) as SeedModule;
    await seedModule.seed(db, context);
  }
}
