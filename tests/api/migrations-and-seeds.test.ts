import { randomBytes } from 'node:crypto';
import { afterAll, describe, expect, inject, it } from 'vitest';
import pg from 'pg';
import { createDb } from '../../server/db/knex';
import { migrateToLatest, rollbackAll, runSeeds } from '../../server/db/migrate';
import { DEMO_ACCOUNTS, DEMO_INSTALLER } from '../../seeds/data/demo-scenario';
import { closeTestDb, testDb } from '../setup/database';
import '../setup/provided';

const connection = inject('database');
const scratch = `${connection.database}_scratch_${randomBytes(2).toString('hex')}`;

async function admin<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ ...connection, database: 'postgres' });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

afterAll(async () => {
  await admin((client) =>
    client.query(`drop database if exists ${pg.escapeIdentifier(scratch)} with (force)`),
  );
  await closeTestDb();
});

describe('migrations', () => {
  it('go all the way down and up again on an empty database', async () => {
    await admin((client) => client.query(`create database ${pg.escapeIdentifier(scratch)}`));
    const db = createDb({ ...connection, database: scratch }, 2);
    try {
      const applied = await migrateToLatest(db);
      expect(applied.length).toBeGreaterThanOrEqual(10);
      const undone = await rollbackAll(db);
      expect(undone).toEqual([...applied].reverse());
      const leftovers = await db('pg_tables')
        .whereIn('schemaname', ['public', 'idp'])
        .whereNotIn('tablename', ['knex_migrations', 'knex_migrations_lock'])
        .pluck('tablename');
      expect(leftovers).toEqual([]);
      const schemas = await db('pg_namespace').where({ nspname: 'idp' }).pluck('nspname');
      expect(schemas).toEqual([]);
      expect(await migrateToLatest(db)).toEqual(applied);
    } finally {
      await db.destroy();
    }
  });
});

describe('demo seed', () => {
  it('seeded this run once, and running it again changes nothing', async () => {
    const db = testDb();
    const count = async (table: string) => Number((await db(table).count('* as n'))[0]!.n);
    const before = { organisations: await count('organisations'), users: await count('users') };
    expect(await db('organisations').where({ name: DEMO_INSTALLER.name }).count('* as n')).toEqual([
      { n: 1 },
    ]);
    await runSeeds(db);
    expect({ organisations: await count('organisations'), users: await count('users') }).toEqual(
      before,
    );
    for (const account of DEMO_ACCOUNTS) {
      expect(await db('users').where({ email: account.email }).count('* as n')).toEqual([{ n: 1 }]);
    }
  });
});
