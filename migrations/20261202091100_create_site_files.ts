import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('site_files', (table) => {
    table.comment('Photos and documents kept with a site; the bytes live in file storage.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    table
      .text('storage_key')
      .notNullable()
      .unique()
      .comment('Key in the storage backend, never a client name');
    table.text('file_name').notNullable().comment('Sanitised name for downloads');
    table.text('content_type').notNullable().comment('Decided from the bytes, not the upload');
    table.bigInteger('size_bytes').notNullable();
    table.text('sha256').notNullable();
    table.text('description').notNullable().defaultTo('');
    table.uuid('uploaded_by').references('users.id').onDelete('SET NULL');
    table.timestamp('uploaded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['site_id', 'uploaded_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('site_files');
}
