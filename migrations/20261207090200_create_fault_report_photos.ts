import type { Knex } from 'knex';

// Photos are ordinary site files (type checked, streamed only to people who may see the site);
// this table says which of them show a reported fault.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('fault_report_photos', (table) => {
    table.comment('Site files that show a reported fault.');
    table.uuid('fault_report_id').notNullable().references('fault_reports.id').onDelete('CASCADE');
    table.uuid('site_file_id').notNullable().references('site_files.id').onDelete('CASCADE');
    table.primary(['fault_report_id', 'site_file_id']);
    table.index(['site_file_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('fault_report_photos');
}
