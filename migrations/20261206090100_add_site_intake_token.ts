import type { Knex } from 'knex';

// IP communicators posting signals over HTTPS present a bearer token; only its hash is kept.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (table) => {
    table
      .text('intake_token_hash')
      .comment('SHA-256 (hex) of the HTTPS intake token; the token itself is shown once');
    table.timestamp('intake_token_issued_at', { useTz: true });
  });
  await knex.raw(`
    alter table sites add constraint sites_intake_token_hash_hex
      check (intake_token_hash ~ '^[0-9a-f]{64}$');
    create unique index sites_intake_token_hash_unique on sites (intake_token_hash)
      where intake_token_hash is not null;
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop index sites_intake_token_hash_unique');
  await knex.schema.alterTable('sites', (table) => {
    table.dropChecks('sites_intake_token_hash_hex');
    table.dropColumn('intake_token_issued_at');
    table.dropColumn('intake_token_hash');
  });
}
