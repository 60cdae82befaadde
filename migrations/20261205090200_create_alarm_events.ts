import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('alarm_events', (table) => {
    table.comment('What an operator handles: one or more signals from a site, and the outcome.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').references('sites.id').onDelete('SET NULL');
    table.text('account').notNullable();
    table
      .enu('category', ['fire', 'hold_up', 'burglary', 'tamper', 'fault', 'other'])
      .notNullable();
    table.integer('priority').notNullable().comment('1 is handled first');
    table.enu('status', ['open', 'taken', 'closed']).notNullable().defaultTo('open');
    table.boolean('confirmed').notNullable().defaultTo(false);
    table.timestamp('confirmed_at', { useTz: true });
    table.specificType('zones', 'integer[]').notNullable().defaultTo('{}');
    table.timestamp('first_signal_at', { useTz: true }).notNullable();
    table.timestamp('last_signal_at', { useTz: true }).notNullable();
    table.timestamp('restored_at', { useTz: true });
    table.uuid('taken_by').references('users.id').onDelete('SET NULL');
    table.timestamp('taken_at', { useTz: true });
    table.timestamp('closed_at', { useTz: true });
    table.text('outcome');
    table.index(['status', 'priority', 'first_signal_at']);
    table.index(['site_id', 'first_signal_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('alarm_events');
}
