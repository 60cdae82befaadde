import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('areas', (table) => {
    table.comment('Parts of a system that set and unset together (EN 50131 partitions).');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('system_id').notNullable().references('systems.id').onDelete('CASCADE');
    table.smallint('number').notNullable();
    table.text('name').notNullable();
  });
  // Deferred, so areas can be renumbered row by row inside one transaction.
  await knex.raw(
    'alter table areas add constraint areas_unique_number unique (system_id, number) deferrable initially deferred',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('areas');
}
