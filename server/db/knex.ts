import knex, { type Knex } from 'knex';
import pg from 'pg';

export interface DatabaseConnection {
  host: string;
  port: number;
  user: string;
  database: string;
  password?: string;
}

// Counts and bigint ids arrive as strings by default; Wardbook's counts fit in a JS number.
pg.types.setTypeParser(pg.types.builtins.INT8, (value) => Number(value));
// Calendar dates stay "YYYY-MM-DD": turning them into instants would let time zones move them.
pg.types.setTypeParser(pg.types.builtins.DATE, (value) => value);

export function knexConfig(connection: DatabaseConnection, poolMax = 10): Knex.Config {
  return { client: 'pg', connection, pool: { min: 0, max: poolMax } };
}

export function createDb(connection: DatabaseConnection, poolMax?: number): Knex {
  return knex(knexConfig(connection, poolMax));
}

export type Db = Knex;
