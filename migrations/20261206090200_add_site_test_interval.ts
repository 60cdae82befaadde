import type { Knex } from 'knex';

// Panels send a periodic test (Contact ID 602, SIA RP); the centre expects one this often.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (table) => {
    table
      .integer('test_interval_minutes')
      .comment('Minutes between periodic test signals; null when none is expected');
  });
  await knex.raw(
    'alter table sites add constraint sites_test_interval_range check (test_interval_minutes between 5 and 10080)',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (table) => {
    table.dropChecks('sites_test_interval_range');
    table.dropColumn('test_interval_minutes');
  });
}
