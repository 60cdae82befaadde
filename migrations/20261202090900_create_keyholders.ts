import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('keyholders', (table) => {
    table.comment('People the monitoring centre calls, in order, when the alarm needs attending.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE');
    table.smallint('call_order').notNullable().comment('1 is called first');
    table.text('name').notNullable();
    table.text('phone').notNullable().comment('Mobile, E.164');
    table.text('email');
    table
      .text('relation')
      .notNullable()
      .defaultTo('')
      .comment('e.g. neighbour, daughter, key-holding company');
    table
      .smallint('minutes_to_attend')
      .notNullable()
      .comment('How long they take to reach the site');
    table
      .jsonb('unavailable')
      .notNullable()
      .defaultTo('[]')
      .comment('[{ from, to, note }] dates when they cannot attend');
    table
      .timestamp('last_confirmed_at', { useTz: true })
      .comment('When the details were last confirmed');
    table
      .uuid('user_id')
      .references('users.id')
      .onDelete('SET NULL')
      .comment('Their Wardbook account, once invited');
    table.integer('version').notNullable().defaultTo(1);
    table.timestamps(true, true);
    table.index(['user_id']);
  });
  await knex.raw(`
    alter table keyholders
      add constraint keyholders_unique_order unique (site_id, call_order) deferrable initially deferred,
      add constraint keyholders_minutes check (minutes_to_attend between 1 and 240)
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('keyholders');
}
