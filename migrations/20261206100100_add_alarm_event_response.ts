import type { Knex } from 'knex';

// What was done about an event beyond taking and closing it: the keyholder call-out and police.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('alarm_events', (table) => {
    table
      .enu('callout_status', ['not_started', 'calling', 'accepted', 'exhausted'])
      .notNullable()
      .defaultTo('not_started');
    table.text('attending_keyholder').comment('Who accepted the call-out');
    table.timestamp('police_requested_at', { useTz: true });
    table.text('police_incident_reference').comment('The police incident or log number given');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('alarm_events', (table) => {
    table.dropColumns(
      'callout_status',
      'attending_keyholder',
      'police_requested_at',
      'police_incident_reference',
    );
  });
}
