import type { Knex } from 'knex';

// The engineer's phone makes a key for the completed visit form, separate from the key the
// office's browser made for the booking: a resend of the form finds the visit it completed.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('service_visits', (table) => {
    table
      .uuid('completion_key')
      .comment('Idempotency key of the completed visit form: a resend is recorded once');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('service_visits', (table) => {
    table.dropColumn('completion_key');
  });
}
