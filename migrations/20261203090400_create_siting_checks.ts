import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('siting_checks', (table) => {
    table.comment('The siting checklist answered for one detector.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('zone_id').notNullable().references('zones.id').onDelete('CASCADE');
    table.uuid('client_key').notNullable().unique();
    table.jsonb('answers').notNullable().comment('{ item: true | false } for each checklist item');
    table.boolean('all_clear').notNullable();
    table.text('note').notNullable().defaultTo('');
    table.uuid('checked_by').references('users.id').onDelete('SET NULL');
    table.timestamp('checked_at', { useTz: true }).notNullable();
    table.index(['zone_id', 'checked_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('siting_checks');
}
