import type { Knex } from 'knex';

// The layout connect-pg-simple reads and writes.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (table) => {
    table.comment('Server-side browser sessions of the API (connect-pg-simple layout).');
    table.string('sid').primary();
    table.json('sess').notNullable();
    table.timestamp('expire', { useTz: false, precision: 6 }).notNullable().index();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
