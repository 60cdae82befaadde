import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('fault_reports', (table) => {
    table.comment('Faults a homeowner reports on their system, queued for the installer office.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    table.uuid('reported_by').references('users.id').onDelete('SET NULL');
    table.text('description').notNullable().comment('The fault in the homeowner words');
    table.enu('status', ['open', 'scheduled', 'closed']).notNullable().defaultTo('open');
    table
      .uuid('visit_id')
      .references('service_visits.id')
      .onDelete('SET NULL')
      .comment('The corrective visit booked for it');
    table.text('closing_note').notNullable().defaultTo('').comment('Why it was closed');
    table
      .uuid('client_key')
      .comment('Idempotency key from the device that sent it: a resend is recorded once');
    table
      .integer('version')
      .notNullable()
      .defaultTo(1)
      .comment('Optimistic concurrency: +1 per edit');
    table.timestamps(true, true);
    table.unique(['site_id', 'client_key']);
    table.index(['site_id', 'status']);
    table.index(['visit_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('fault_reports');
}
