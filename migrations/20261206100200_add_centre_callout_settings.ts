import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('organisations', (table) => {
    table
      .smallint('callout_wait_minutes')
      .notNullable()
      .defaultTo(5)
      .comment('Monitoring centres: minutes to wait for a keyholder to accept before the next');
    table
      .boolean('callout_automatic')
      .notNullable()
      .defaultTo(false)
      .comment('Monitoring centres: message keyholders as soon as a burglary or fire event opens');
  });
  await knex.raw(
    'alter table organisations add constraint organisations_callout_wait_range check (callout_wait_minutes between 1 and 30)',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('organisations', (table) => {
    table.dropChecks('organisations_callout_wait_range');
    table.dropColumns('callout_wait_minutes', 'callout_automatic');
  });
}
