import type { Knex } from 'knex';

// The identity provider keeps its own tables apart from the app's, in the same database.
export async function up(knex: Knex): Promise<void> {
  await knex.raw('create schema idp');
  await knex.raw(`comment on schema idp is 'State of the Wardbook identity provider (idp/)'`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop schema idp');
}
