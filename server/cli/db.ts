import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import { loadConfig } from '../config/config';
import { createDb } from '../db/knex';
import { createLocalDiskStorage } from '../files/storage';
import { migrateToLatest, migrationSource, MIGRATIONS_TABLE, runSeeds } from '../db/migrate';
import { migrationsDir } from '../paths';
import { openLocalDatabase } from './prepare-database';

/**
 * npm run db:migrate | db:rollback | db:seed | db:make -- <what_it_does>
 * Starts the project's PostgreSQL if needed (leaving it running only if it was already up).
 */
const [command, name] = process.argv.slice(2);

const STUB = `import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // One change per migration; comment new tables and columns.
}

export async function down(knex: Knex): Promise<void> {
  // Undo exactly what up() did.
}
`;

async function main() {
  if (command === 'make') {
    if (!name || !/^[a-z][a-z0-9_]*$/.test(name)) {
      throw new Error('Name the migration in snake_case: npm run db:make -- add_sites_table');
    }
    const stamp = new Date().toISOString().replace(/\D/g, '').slice(0, 14);
    const file = path.join(migrationsDir, `${stamp}_${name}.ts`);
    await writeFile(file, STUB, { flag: 'wx' });
    console.log(`created ${path.relative(process.cwd(), file)}`);
    return;
  }

  const config = loadConfig();
  const postgres = await openLocalDatabase(config, console.log);
  const db = createDb(config.postgres, 2);
  try {
    if (command === 'migrate') {
      const applied = await migrateToLatest(db);
      console.log(applied.length ? `applied:\n  ${applied.join('\n  ')}` : 'already up to date');
    } else if (command === 'rollback') {
      const [, undone] = (await db.migrate.rollback({
        migrationSource,
        tableName: MIGRATIONS_TABLE,
      })) as [number, string[]];
      console.log(
        undone.length ? `rolled back:\n  ${undone.join('\n  ')}` : 'nothing to roll back',
      );
    } else if (command === 'seed') {
      await runSeeds(db, { storage: createLocalDiskStorage(path.join(config.dataDir, 'files')) });
      console.log('seeds run (the demo is only added to an empty database)');
    } else {
      throw new Error(`unknown command "${command}"; use migrate, rollback, seed or make`);
    }
  } finally {
    await db.destroy();
    await postgres.stop();
  }
}

main().catch((error: unknown) => {
  console.error((error as Error).message);
  process.exitCode = 1;
});
