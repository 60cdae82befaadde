import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('change_requests', (table) => {
    // (Knex does not escape quotes in comments, so none are used.)
    table.comment(
      'Requests from homeowners to their installer: add a detector, move a keypad, and so on.',
    );
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    table.uuid('requested_by').references('users.id').onDelete('SET NULL');
    table.text('subject').notNullable();
    table.text('details').notNullable();
    table.enu('status', ['open', 'closed']).notNullable().defaultTo('open');
    table.timestamps(true, true);
    table.index(['site_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('change_requests');
}
