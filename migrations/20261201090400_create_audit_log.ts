import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_log', (table) => {
    table.comment('Who did what and when. Rows are only ever added.');
    table.bigIncrements('id').primary();
    table.timestamp('occurred_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    // No foreign keys: the log must outlive the rows it mentions.
    table.uuid('actor_user_id').comment('Wardbook user who acted; empty for anonymous events');
    table.text('actor_label').comment('Name or e-mail as it was when the event happened');
    table.text('action').notNullable().comment('dotted verb, e.g. sign_in.failed');
    table.text('entity_type');
    table.text('entity_id');
    table.uuid('organisation_id').comment('Organisation whose office may read the entry');
    table.text('summary').notNullable();
    table.jsonb('changes').comment('Field-level before/after values; never secrets');
    table.text('ip');
    table.text('request_id');
    table.index(['organisation_id', 'occurred_at']);
    table.index(['actor_user_id', 'occurred_at']);
    table.index(['entity_type', 'entity_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_log');
}
