import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('walk_tests', (table) => {
    table.comment(
      'A zone proved at commissioning or service: loop readings and whether it passed.',
    );
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('zone_id').notNullable().references('zones.id').onDelete('CASCADE');
    table
      .uuid('client_key')
      .notNullable()
      .unique()
      .comment('Idempotency key from the device that recorded it');
    table
      .decimal('secure_reading_ohms', 12, 3)
      .comment('Loop resistance with the detector secure; null = open');
    table
      .boolean('secure_open')
      .notNullable()
      .defaultTo(false)
      .comment('Meter showed open circuit (OL)');
    table.text('secure_state').notNullable();
    table
      .decimal('alarm_reading_ohms', 12, 3)
      .comment('Loop resistance with the detector in alarm, if read');
    table.boolean('alarm_open').notNullable().defaultTo(false);
    table.text('alarm_state');
    table
      .boolean('activated')
      .notNullable()
      .comment('The panel showed the zone when the detector was walked');
    table.boolean('passed').notNullable();
    table.text('note').notNullable().defaultTo('');
    table.uuid('tested_by').references('users.id').onDelete('SET NULL');
    table.timestamp('tested_at', { useTz: true }).notNullable();
    table.timestamp('recorded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['zone_id', 'tested_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('walk_tests');
}
