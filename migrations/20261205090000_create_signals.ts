import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('signals', (table) => {
    table.comment(
      'Every alarm signal received, as committed before it was acknowledged to the panel.',
    );
    table.bigIncrements('id');
    table.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.enu('transport', ['dc09_tcp', 'https']).notNullable();
    table.text('protocol').notNullable().comment('DC-09 message ID: SIA-DCS, ADM-CID …');
    table.text('account').notNullable();
    table.text('sequence').notNullable();
    table.text('receiver');
    table.text('line_prefix');
    table
      .text('data')
      .notNullable()
      .comment('The payload as sent (decrypted when it was encrypted)');
    table.boolean('was_encrypted').notNullable().defaultTo(false);
    table
      .timestamp('panel_time', { useTz: true })
      .comment('The panel clock, when the frame had one');
    table.text('raw').notNullable().comment('The frame as it arrived');
    table.uuid('site_id').references('sites.id').onDelete('SET NULL');
    table.boolean('unknown_account').notNullable().defaultTo(false);
    table.text('event_code').comment('Contact ID XYZ or SIA two-letter code');
    table
      .enu('category', [
        'fire',
        'hold_up',
        'burglary',
        'tamper',
        'fault',
        'open_close',
        'test',
        'other',
      ])
      .notNullable();
    table.enu('qualifier', ['new', 'restore', 'status']).notNullable();
    table.integer('zone_or_user').comment('Zone number for alarms, user number for open/close');
    table.integer('partition');
    table.index(['account', 'sequence', 'received_at']);
    table.index(['site_id', 'received_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('signals');
}
