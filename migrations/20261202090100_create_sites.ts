import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sites', (table) => {
    table.comment('Premises with an intruder-alarm system, maintained by one installer.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table
      .uuid('installer_id')
      .notNullable()
      .references('organisations.id')
      .onDelete('RESTRICT')
      .comment('The installer that maintains the system');
    table.text('reference').notNullable().comment('Site reference of the installer, e.g. S-0042');
    table.text('name').notNullable();
    table.enu('premises_type', ['domestic', 'commercial']).notNullable();
    table.text('address_line1').notNullable();
    table.text('address_line2').notNullable().defaultTo('');
    table.text('town').notNullable();
    table.text('postcode').notNullable().comment('UK postcode, upper case with one space');
    table
      .text('access_notes')
      .notNullable()
      .defaultTo('')
      .comment('How to get in and where things are');
    table
      .text('hazards')
      .notNullable()
      .defaultTo('')
      .comment('Dangers to anyone attending or working');
    table
      .text('risk_notes')
      .notNullable()
      .defaultTo('')
      .comment('Survey notes: contents, past losses, insurer');
    table
      .smallint('required_grade')
      .notNullable()
      .comment('EN 50131-1 security grade 1-4 the site needs');
    table.text('grade_rationale').notNullable().defaultTo('');
    table
      .smallint('environmental_class')
      .notNullable()
      .comment('EN 50131-1 environmental class I-IV as 1-4');
    table.text('police_urn').comment('Police unique reference number for police response');
    table
      .enu('urn_status', ['none', 'applied', 'active', 'warning', 'withdrawn'])
      .notNullable()
      .defaultTo('none')
      .comment('Police response status under NPCC policy');
    table.uuid('monitoring_centre_id').references('organisations.id').onDelete('RESTRICT');
    table.text('monitoring_account').comment('Account number at the monitoring centre');
    table
      .integer('version')
      .notNullable()
      .defaultTo(1)
      .comment('Optimistic concurrency: +1 per edit');
    table.timestamps(true, true);
    table.unique(['installer_id', 'reference']);
    table.unique(['monitoring_centre_id', 'monitoring_account']);
    table.index(['installer_id', 'name']);
    table.index(['monitoring_centre_id']);
  });
  await knex.raw(`
    alter table sites
      add constraint sites_required_grade check (required_grade between 1 and 4),
      add constraint sites_environmental_class check (environmental_class between 1 and 4),
      add constraint sites_monitoring_pair check ((monitoring_centre_id is null) = (monitoring_account is null)),
      add column search_text text generated always as (
        lower(reference || ' ' || name || ' ' || address_line1 || ' ' || address_line2 || ' ' || town || ' ' || postcode)
      ) stored;
    create index sites_search_trgm on sites using gin (search_text gin_trgm_ops);
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sites');
}
