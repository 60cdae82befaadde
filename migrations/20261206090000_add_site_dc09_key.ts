import type { Knex } from 'knex';

// SIA DC-09 encryption: AES with a key per account, 128, 192 or 256 bits, kept as hex.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (table) => {
    table
      .text('dc09_key')
      .comment(
        'AES key for encrypted DC-09 frames from this account, upper-case hex; a secret, never sent to browsers',
      );
  });
  await knex.raw(
    `alter table sites add constraint sites_dc09_key_hex check (dc09_key ~ '^([0-9A-F]{32}|[0-9A-F]{48}|[0-9A-F]{64})$')`,
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (table) => {
    table.dropChecks('sites_dc09_key_hex');
    table.dropColumn('dc09_key');
  });
}
