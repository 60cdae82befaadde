import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('signing_requests', (table) => {
    table.comment('A homeowner asked by e-mail to countersign a handover after signing in.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('draft_id').notNullable().references('handover_drafts.id').onDelete('CASCADE');
    table.uuid('homeowner_user_id').notNullable().references('users.id').onDelete('CASCADE');
    table.text('sent_to').notNullable();
    table.uuid('sent_by').references('users.id').onDelete('SET NULL');
    table.timestamp('sent_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('signed_at', { useTz: true });
    table.timestamp('withdrawn_at', { useTz: true });
    table.index(['draft_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('signing_requests');
}
