import type { Knex } from 'knex';

// There is deliberately no column for the code itself: Wardbook never asks for, stores or sends it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('user_code_slots', (table) => {
    table.comment('Who holds each user-code slot on the panel, never the code.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    table.smallint('slot').notNullable().comment('Slot number at the panel');
    table.text('holder_name').notNullable();
    table
      .smallint('access_level')
      .notNullable()
      .comment('EN 50131-1 access level: 2 user, 3 engineer');
    table.specificType('area_numbers', 'smallint[]').notNullable().defaultTo('{}');
    table.date('valid_from');
    table.date('valid_to');
    table.boolean('active').notNullable().defaultTo(true);
    table.uuid('changed_by').references('users.id').onDelete('SET NULL');
    table.timestamp('changed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.integer('version').notNullable().defaultTo(1);
    table.unique(['site_id', 'slot']);
  });
  await knex.raw(`
    alter table user_code_slots
      add constraint user_code_slots_level check (access_level in (2, 3)),
      add constraint user_code_slots_slot check (slot between 1 and 999),
      add constraint user_code_slots_dates check (valid_to is null or valid_from is null or valid_to >= valid_from)
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('user_code_slots');
}
