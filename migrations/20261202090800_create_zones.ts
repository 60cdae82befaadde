import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('zones', (table) => {
    table.comment('The as-fitted zone schedule: one detector circuit per row.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('system_id').notNullable().references('systems.id').onDelete('CASCADE');
    table
      .smallint('position')
      .notNullable()
      .comment('Order on the schedule as the engineer arranged it');
    table.smallint('number').notNullable().comment('Zone number programmed at the panel');
    table.text('location').notNullable();
    table
      .enu('zone_type', [
        'entry_exit',
        'entry_route',
        'instant',
        '24_hour',
        'hold_up',
        'fire',
        'technical',
        'set_unset',
        'unassigned',
      ])
      .notNullable();
    table
      .enu('detector_kind', [
        'pir',
        'dual_technology',
        'magnetic_contact',
        'vibration',
        'glass_break',
        'hold_up_button',
        'smoke',
        'heat',
        'key_switch',
        'other',
      ])
      .notNullable();
    table.text('detector_model').notNullable().defaultTo('');
    table
      .enu('loop_wiring', ['two_resistor', 'one_resistor', 'closed_loop_separate_tamper'])
      .notNullable();
    table.integer('tamper_ohms').comment('Series (tamper) resistor, ohms; two-resistor loops only');
    table
      .integer('alarm_ohms')
      .comment('Alarm resistor across the contact (or end-of-line resistor), ohms');
    table
      .jsonb('core_map')
      .notNullable()
      .defaultTo('[]')
      .comment('[{ colour, terminal }] as wired at the panel');
    table.uuid('area_id').references('areas.id').onDelete('SET NULL');
    table.specificType('attributes', 'text[]').notNullable().defaultTo('{}');
    table.smallint('grade');
    table.smallint('environmental_class');
    table.decimal('quiescent_ma', 8, 2);
    table.decimal('alarm_ma', 8, 2);
  });
  // Deferred, so a schedule can be renumbered or reordered row by row inside one transaction.
  await knex.raw(`
    alter table zones
      add constraint zones_unique_number unique (system_id, number) deferrable initially deferred,
      add constraint zones_unique_position unique (system_id, position) deferrable initially deferred,
      add constraint zones_number check (number between 1 and 999),
      add constraint zones_resistors check (
        (tamper_ohms is null or tamper_ohms between 1 and 1000000)
        and (alarm_ohms is null or alarm_ohms between 1 and 1000000)
      ),
      add constraint zones_wiring_resistors check (
        (loop_wiring = 'two_resistor' and tamper_ohms is not null and alarm_ohms is not null)
        or (loop_wiring = 'one_resistor' and tamper_ohms is null and alarm_ohms is not null)
        or (loop_wiring = 'closed_loop_separate_tamper' and tamper_ohms is null and alarm_ohms is null)
      ),
      add constraint zones_grade check (grade is null or grade between 1 and 4),
      add constraint zones_environmental_class check (environmental_class is null or environmental_class between 1 and 4),
      add constraint zones_currents check ((quiescent_ma is null or quiescent_ma >= 0) and (alarm_ma is null or alarm_ma >= 0))
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('zones');
}
