import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.withSchema('idp').createTable('oidc_payloads', (table) => {
    table.comment('Every oidc-provider model (sessions, grants, codes, tokens, interactions).');
    table.text('model').notNullable().comment('oidc-provider model name, e.g. Session, Grant');
    table.text('id').notNullable();
    table.jsonb('payload').notNullable();
    table.text('grant_id');
    table.text('user_code');
    table.text('uid');
    table.timestamp('expires_at', { useTz: true });
    table.timestamp('consumed_at', { useTz: true });
    table.primary(['model', 'id']);
    table.index(['grant_id']);
    table.index(['model', 'uid']);
    table.index(['model', 'user_code']);
    table.index(['expires_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.withSchema('idp').dropTable('oidc_payloads');
}
