import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.withSchema('idp').createTable('password_tokens', (table) => {
    table.comment('Single-use links to reset a password or set one after an invitation.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table
      .uuid('account_id')
      .notNullable()
      .references('id')
      .inTable('idp.accounts')
      .onDelete('CASCADE');
    table.enu('purpose', ['reset', 'invitation']).notNullable();
    table.text('token_hash').notNullable().unique().comment('SHA-256 of the token in the link');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('expires_at', { useTz: true }).notNullable();
    table.timestamp('used_at', { useTz: true });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.withSchema('idp').dropTable('password_tokens');
}
