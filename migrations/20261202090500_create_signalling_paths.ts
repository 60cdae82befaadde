import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('signalling_paths', (table) => {
    table.comment('Paths the system signals over (alarm transmission system), in priority order.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('system_id').notNullable().references('systems.id').onDelete('CASCADE');
    table.smallint('position').notNullable().comment('1 = primary path');
    table.enu('bearer', ['ip', 'cellular', 'pstn', 'radio']).notNullable();
    table
      .text('ats_category')
      .notNullable()
      .defaultTo('')
      .comment('EN 50136-1 category as written on the equipment, e.g. SP2 or DP3');
    table.text('description').notNullable().defaultTo('');
    table.boolean('to_monitoring_centre').notNullable().defaultTo(true);
    table.unique(['system_id', 'position']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('signalling_paths');
}
