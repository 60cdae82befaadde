import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.withSchema('idp').createTable('accounts', (table) => {
    table.comment('Sign-in credentials. The id is the subject (sub) the IdP issues.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.text('email').notNullable();
    table.text('display_name').notNullable();
    table.text('password_hash').comment('argon2id; empty until an invited person sets one');
    table.timestamp('password_changed_at', { useTz: true });
    table.text('totp_secret').comment('base32 secret of an enrolled authenticator');
    table.text('totp_pending_secret').comment('secret shown during enrolment, not yet proven');
    table.bigInteger('totp_last_step').comment('last accepted 30 s step, so a code works once');
    table.integer('failed_attempts').notNullable().defaultTo(0);
    table.timestamp('locked_until', { useTz: true }).comment('backoff after failed attempts');
    table.timestamps(true, true);
  });
  await knex.raw('create unique index accounts_email_unique on idp.accounts (lower(email))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.withSchema('idp').dropTable('accounts');
}
