import type { Knex } from 'knex';

// BS 8243 sequential confirmation: a second, different detector within the site's window.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (table) => {
    table
      .integer('confirmation_window_minutes')
      .notNullable()
      .defaultTo(30)
      .comment('Sequential confirmation window, 30 to 60 minutes (BS 8243)');
  });
  await knex.raw(
    'alter table sites add constraint sites_confirmation_window_range check (confirmation_window_minutes between 30 and 60)',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('sites', (table) => {
    table.dropChecks('sites_confirmation_window_range');
    table.dropColumn('confirmation_window_minutes');
  });
}
