import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('handover_drafts', (table) => {
    table.comment(
      'The handover being prepared for a site: variations and signatures, until the pack is issued.',
    );
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').notNullable().unique().references('sites.id').onDelete('CASCADE');
    table
      .jsonb('variations')
      .notNullable()
      .defaultTo('[]')
      .comment('Blocking problems written down for the customer to accept');
    table.text('engineer_signature').comment('PNG data URL');
    table.uuid('engineer_user_id').references('users.id').onDelete('SET NULL');
    table.text('engineer_name');
    table.timestamp('engineer_signed_at', { useTz: true });
    table.text('customer_signature').comment('PNG data URL');
    table.text('customer_name');
    table.uuid('customer_user_id').references('users.id').onDelete('SET NULL');
    table.enu('customer_signed_via', ['in_person', 'request']);
    table.timestamp('customer_signed_at', { useTz: true });
    table.integer('version').notNullable().defaultTo(1);
    table.timestamps(true, true);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('handover_drafts');
}
