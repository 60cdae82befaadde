import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('event_timeline', (table) => {
    table.comment('Everything that happened to an event, in order.');
    table.bigIncrements('id');
    table.uuid('event_id').notNullable().references('alarm_events.id').onDelete('CASCADE');
    table.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.text('kind').notNullable();
    table.text('text').notNullable();
    table.uuid('actor_user_id').references('users.id').onDelete('SET NULL');
    table.index(['event_id', 'at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('event_timeline');
}
