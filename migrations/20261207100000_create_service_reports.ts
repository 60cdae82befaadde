import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('service_reports', (table) => {
    table.comment(
      'The report PDF of a completed service visit: queued with the completion, drawn by a durable job, then e-mailed to the homeowners.',
    );
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table
      .uuid('visit_id')
      .notNullable()
      .unique()
      .references('service_visits.id')
      .onDelete('CASCADE')
      .comment('One report per completed visit');
    table.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    table
      .enu('status', ['queued', 'done', 'failed'])
      .notNullable()
      .defaultTo('queued')
      .comment('queued until the PDF is stored; failed keeps the reason in error');
    table.text('pdf_key').comment('Storage key of the PDF once drawn');
    table.integer('size_bytes').comment('Size of the stored PDF');
    table.text('error').comment('Why the last attempt failed, for the office');
    table
      .timestamp('emailed_at', { useTz: true })
      .comment('When the homeowners were sent it; set before sending, so never sent twice');
    table.timestamps(true, true);
    table.index(['status']);
  });
  await knex.raw(`
    alter table service_reports
      add constraint service_reports_done_has_pdf
        check ((status = 'done') = (pdf_key is not null));
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('service_reports');
}
