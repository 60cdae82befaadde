import type { Knex } from 'knex';

// A fault raised by the receiver itself when a periodic test is overdue, rather than by a signal.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('alarm_events', (table) => {
    table
      .boolean('raised_by_missed_test')
      .notNullable()
      .defaultTo(false)
      .comment('Raised because the periodic test was not received in time');
  });
  // One open missed-test fault per site at a time, however many sweeps run at once.
  await knex.raw(`
    create unique index alarm_events_one_open_missed_test on alarm_events (site_id)
      where raised_by_missed_test and status <> 'closed'
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop index alarm_events_one_open_missed_test');
  await knex.schema.alterTable('alarm_events', (table) => {
    table.dropColumn('raised_by_missed_test');
  });
}
