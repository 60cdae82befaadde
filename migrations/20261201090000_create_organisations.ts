import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('organisations', (table) => {
    table.comment('Installer companies and monitoring centres; every staff record belongs to one.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table
      .enu('kind', ['installer', 'monitoring_centre'])
      .notNullable()
      .comment('installer maintains sites; monitoring_centre receives their signals');
    table.text('name').notNullable();
    table.timestamps(true, true);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('organisations');
}
