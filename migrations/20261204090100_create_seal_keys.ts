import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('seal_keys', (table) => {
    table.comment(
      'Ed25519 keys each installer seals packs with. Retired keys stay, so old seals still verify.',
    );
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('organisation_id').notNullable().references('organisations.id').onDelete('CASCADE');
    table.text('public_key').notNullable().comment('SPKI PEM, published');
    table
      .text('private_key_sealed')
      .notNullable()
      .comment('PKCS8 DER under AES-256-GCM with the key-encryption secret of the data folder');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('retired_at', { useTz: true });
  });
  // One current key per organisation.
  await knex.raw(
    'create unique index seal_keys_one_current on seal_keys (organisation_id) where retired_at is null',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('seal_keys');
}
