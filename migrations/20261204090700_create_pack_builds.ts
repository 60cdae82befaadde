import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('pack_builds', (table) => {
    table.comment('Each request to issue a pack, built off the request path, with its progress.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    table.uuid('draft_id').references('handover_drafts.id').onDelete('SET NULL');
    table.integer('draft_version').notNullable().comment('The signed draft this build issues');
    table.enu('status', ['queued', 'running', 'done', 'failed']).notNullable().defaultTo('queued');
    table
      .enu('stage', ['queued', 'collecting', 'rendering', 'sealing', 'sending', 'done'])
      .notNullable()
      .defaultTo('queued');
    table.uuid('pack_id').references('handover_packs.id');
    table.text('error');
    table.uuid('requested_by').references('users.id').onDelete('SET NULL');
    table.timestamps(true, true);
    table.index(['site_id', 'status']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('pack_builds');
}
