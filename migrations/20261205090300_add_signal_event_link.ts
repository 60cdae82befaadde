import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('signals', (table) => {
    table
      .uuid('event_id')
      .references('alarm_events.id')
      .onDelete('SET NULL')
      .comment('The event this signal opened, confirmed or restored');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('signals', (table) => {
    table.dropColumn('event_id');
  });
}
