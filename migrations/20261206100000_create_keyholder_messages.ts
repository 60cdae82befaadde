import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('keyholder_messages', (table) => {
    table.comment(
      'Text messages to keyholders about an alarm event: the outbox the sender works through, and what came of each.',
    );
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('event_id').notNullable().references('alarm_events.id').onDelete('CASCADE');
    table.uuid('keyholder_id').references('keyholders.id').onDelete('SET NULL');
    table.smallint('call_order').notNullable().comment('Their place in the call plan when sent');
    table.text('keyholder_name').notNullable();
    table.text('phone').notNullable().comment('E.164, as it was when the message was queued');
    table.text('body').notNullable();
    table
      .text('reference')
      .notNullable()
      .unique()
      .comment('Short reference in the text, to find the message at the provider after a crash');
    table
      .enu('status', ['queued', 'sending', 'sent', 'delivered', 'failed', 'undelivered'])
      .notNullable()
      .defaultTo('queued');
    table.integer('attempts').notNullable().defaultTo(0);
    table.text('provider_sid').unique().comment('The Twilio message SID once accepted');
    table.text('error');
    table.timestamp('queued_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('claimed_at', { useTz: true }).comment('When a sender last took it');
    table.timestamp('sent_at', { useTz: true });
    table.timestamp('delivered_at', { useTz: true });
    table.enu('reply', ['attending', 'cannot_attend']);
    table.timestamp('replied_at', { useTz: true });
    table.text('escalation_job_id').comment('The durable job that moves on if nobody accepts');
    table.index(['status', 'queued_at']);
    table.index(['phone', 'queued_at']);
    table.index(['event_id', 'call_order']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('keyholder_messages');
}
