import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('pack_revocations', (table) => {
    table.comment(
      'Packs withdrawn by the office, kept apart so the packs themselves never change.',
    );
    table.uuid('pack_id').primary().references('handover_packs.id');
    table.text('reason').notNullable();
    table.uuid('revoked_by').references('users.id').onDelete('SET NULL');
    table.timestamp('revoked_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('pack_revocations');
}
