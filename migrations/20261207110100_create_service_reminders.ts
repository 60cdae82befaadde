import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('service_reminders', (table) => {
    table.comment(
      'Each service reminder once: written before it is sent, so a second sweep or a restart never sends it again.',
    );
    table.bigIncrements('id');
    table.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    table.enu('kind', ['visit_due_soon', 'visit_overdue']).notNullable();
    table.date('due_date').notNullable().comment('The preventive visit due date it is about');
    table.enu('channel', ['email', 'sms']).notNullable();
    table.text('recipient').notNullable().comment('E-mail address or E.164 number');
    table.enu('status', ['sending', 'sent', 'failed']).notNullable().defaultTo('sending');
    table.text('error');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('sent_at', { useTz: true });
    table.unique(['site_id', 'kind', 'due_date', 'channel', 'recipient']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('service_reminders');
}
