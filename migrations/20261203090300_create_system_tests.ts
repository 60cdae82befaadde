import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('system_tests', (table) => {
    table.comment('Sounder, signalling and battery tests at commissioning or service.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('system_id').notNullable().references('systems.id').onDelete('CASCADE');
    table
      .uuid('client_key')
      .notNullable()
      .unique()
      .comment('Idempotency key from the device that recorded it');
    table.enu('kind', ['sounders', 'signalling', 'battery']).notNullable();
    table.boolean('passed').notNullable();
    table
      .jsonb('details')
      .notNullable()
      .defaultTo('{}')
      .comment('Kind-specific measurements and notes');
    table.uuid('tested_by').references('users.id').onDelete('SET NULL');
    table.timestamp('tested_at', { useTz: true }).notNullable();
    table.timestamp('recorded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['system_id', 'kind', 'tested_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('system_tests');
}
