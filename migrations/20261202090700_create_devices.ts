import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('devices', (table) => {
    table.comment(
      'Powered equipment other than zone detectors: keypads, sounders, expanders, communicators.',
    );
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('system_id').notNullable().references('systems.id').onDelete('CASCADE');
    table.smallint('position').notNullable().comment('Order on the schedule');
    table
      .enu('kind', [
        'keypad',
        'internal_sounder',
        'external_sounder',
        'expander',
        'communicator',
        'power_supply',
        'other',
      ])
      .notNullable();
    table.text('location').notNullable();
    table.text('model').notNullable().defaultTo('');
    table.uuid('area_id').references('areas.id').onDelete('SET NULL');
    table.smallint('grade').comment('EN 50131 grade of the component, 1-4');
    table.smallint('environmental_class').comment('I-IV as 1-4');
    table.decimal('quiescent_ma', 8, 2).comment('Current drawn when idle, mA');
    table.decimal('alarm_ma', 8, 2).comment('Current drawn in alarm, mA');
  });
  await knex.raw(`
    alter table devices
      add constraint devices_unique_position unique (system_id, position) deferrable initially deferred,
      add constraint devices_grade check (grade is null or grade between 1 and 4),
      add constraint devices_environmental_class check (environmental_class is null or environmental_class between 1 and 4),
      add constraint devices_currents check ((quiescent_ma is null or quiescent_ma >= 0) and (alarm_ma is null or alarm_ma >= 0))
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('devices');
}
