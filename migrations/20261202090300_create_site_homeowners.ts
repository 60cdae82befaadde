import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('site_homeowners', (table) => {
    table.comment('Homeowners (customers) of a site: the people who may see and manage it.');
    table.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    table.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    table.timestamp('added_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.primary(['site_id', 'user_id']);
    table.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('site_homeowners');
}
