import type { Knex } from 'knex';

// The reasons a walk test failed, in the words shown at the time, kept with the record.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('walk_tests', (table) => {
    table.jsonb('failures').notNullable().defaultTo('[]').comment('Plain-words reasons it failed');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('walk_tests', (table) => {
    table.dropColumn('failures');
  });
}
