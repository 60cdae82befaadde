import { inject } from 'vitest';
import type { Knex } from 'knex';
import { createDb } from '../../server/db/knex';
import './provided';

let db: Knex | undefined;

/** A Knex handle on this run's throwaway database, one per test worker. */
export function testDb(): Knex {
  db ??= createDb(inject('database'), 4);
  return db;
}

export async function closeTestDb() {
  await db?.destroy();
  db = undefined;
}
