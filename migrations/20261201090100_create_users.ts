import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (table) => {
    table.comment('People who use Wardbook; identity and credentials live at the IdP.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table
      .text('idp_subject')
      .notNullable()
      .unique()
      .comment('The "sub" claim the identity provider issues for this person');
    table.text('email').notNullable();
    table.text('display_name').notNullable();
    table.timestamp('disabled_at', { useTz: true }).comment('Set when access is withdrawn');
    table.timestamps(true, true);
  });
  await knex.raw('create unique index users_email_unique on users (lower(email))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users');
}
