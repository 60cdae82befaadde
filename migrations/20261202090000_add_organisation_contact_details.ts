import type { Knex } from 'knex';

// Homeowners' "who to call" card and keyholders' messages need each organisation's numbers.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('organisations', (table) => {
    table.text('phone').comment('Office line, E.164');
    table.text('out_of_hours_phone').comment('Emergency or out-of-hours line, E.164');
    table.text('email');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('organisations', (table) => {
    table.dropColumns('phone', 'out_of_hours_phone', 'email');
  });
}
