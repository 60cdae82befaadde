import type { Knex } from 'knex';

// Trigram indexes let the sites table search names, addresses and postcodes by fragment.
export async function up(knex: Knex): Promise<void> {
  await knex.raw('create extension if not exists pg_trgm');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop extension if exists pg_trgm');
}
