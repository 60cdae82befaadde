import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('service_visits', (table) => {
    table.comment(
      'Maintenance visits to a site after handover: preventive (planned) and corrective (call-outs).',
    );
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    table.enu('kind', ['preventive', 'corrective']).notNullable();
    table.enu('status', ['scheduled', 'done', 'cancelled']).notNullable().defaultTo('scheduled');
    table
      .date('due_date')
      .notNullable()
      .comment('The day the visit falls due: the service plan date, or the call-out target');
    table
      .timestamp('scheduled_for', { useTz: true })
      .comment('When the engineer is booked to attend; null until booked');
    table
      .uuid('engineer_id')
      .references('users.id')
      .onDelete('SET NULL')
      .comment('The engineer of the site installer who attends');
    table
      .smallint('plan_visits_per_year')
      .comment(
        'Preventive visits a year under the plan in force when the visit was booked or done',
      );
    table.timestamp('completed_at', { useTz: true }).comment('When the visit was finished on site');
    table
      .jsonb('checklist')
      .notNullable()
      .defaultTo('{}')
      .comment(
        'Preventive checklist: battery voltage and load test, zones walk-tested with readings, tampers, sounders, signalling, user training and confidence, items not tested',
      );
    table.text('customer_name').comment('Who signed for the items not tested');
    table.text('customer_signature').comment('PNG data URL drawn by the customer');
    table.text('reported_fault').comment('Corrective: the fault as reported');
    table.text('prime_cause').comment('Corrective: the prime cause found');
    table.text('action_taken').comment('Corrective: what the engineer did');
    table
      .jsonb('parts_replaced')
      .notNullable()
      .defaultTo('[]')
      .comment('Corrective: parts replaced, each tested after fitting');
    table.boolean('false_alarm').comment('Corrective: whether the call-out followed a false alarm');
    table.text('false_alarm_cause').comment('Corrective: the cause of that false alarm');
    table
      .uuid('client_key')
      .comment('Idempotency key from the device that sent it: a resend is recorded once');
    table.uuid('created_by').references('users.id').onDelete('SET NULL');
    table
      .integer('version')
      .notNullable()
      .defaultTo(1)
      .comment('Optimistic concurrency: +1 per edit');
    table.timestamps(true, true);
    table.unique(['site_id', 'client_key']);
    table.index(['site_id', 'kind', 'status', 'completed_at']);
    table.index(['engineer_id', 'scheduled_for']);
    table.index(['due_date']);
  });
  await knex.raw(`
    alter table service_visits
      add constraint service_visits_done_when_completed
        check ((status = 'done') = (completed_at is not null)),
      add constraint service_visits_plan_range
        check (plan_visits_per_year is null or plan_visits_per_year in (1, 2)),
      add constraint service_visits_false_alarm_cause
        check (false_alarm_cause is null or false_alarm is true);
    create unique index service_visits_one_booked_preventive
      on service_visits (site_id) where kind = 'preventive' and status = 'scheduled';
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('service_visits');
}
