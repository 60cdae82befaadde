import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('handover_packs', (table) => {
    table.comment('Issued handover packs: frozen, hashed and sealed. Never updated or deleted.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').notNullable().references('sites.id').onDelete('RESTRICT');
    table.uuid('organisation_id').notNullable().references('organisations.id');
    table.text('pack_number').notNullable().unique();
    table.integer('serial').notNullable().comment('The gap-free sequence number');
    table.integer('revision').notNullable();
    table.uuid('supersedes_id').unique().references('handover_packs.id');
    table.jsonb('snapshot').notNullable().comment('Every value the PDF shows');
    table.text('pdf_key').notNullable().comment('Storage key of the PDF bytes');
    table.text('sha256').notNullable();
    table.integer('size_bytes').notNullable();
    table.uuid('seal_key_id').notNullable().references('seal_keys.id');
    table.text('sealed_text').notNullable().comment('Exactly what the Ed25519 seal signs');
    table.text('seal').notNullable().comment('Ed25519 signature, base64');
    table.timestamp('issued_at', { useTz: true }).notNullable();
    table.uuid('issued_by').references('users.id').onDelete('SET NULL');
    table.text('issued_by_name').notNullable();
    table.unique(['organisation_id', 'serial', 'revision']);
    table.index(['site_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('handover_packs');
}
