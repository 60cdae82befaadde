import type { Knex } from 'knex';

// What the power budget and the loop calculations need from the system as a whole.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('systems', (table) => {
    table.smallint('panel_grade').comment('EN 50131 grade of the control panel itself');
    table.decimal('panel_quiescent_ma', 8, 2).comment('Control panel current when idle, mA');
    table.decimal('panel_alarm_ma', 8, 2).comment('Control panel current in alarm, mA');
    table
      .smallint('sounder_minutes')
      .notNullable()
      .defaultTo(15)
      .comment('External sounder cut-off, minutes');
    table
      .decimal('standby_hours_override', 5, 1)
      .comment('Standby time the specification requires, where the table has none');
    table
      .decimal('resistor_tolerance', 4, 3)
      .notNullable()
      .defaultTo(0.05)
      .comment('End-of-line resistor tolerance, fraction');
    table
      .text('cable_core')
      .notNullable()
      .defaultTo('7/0.2')
      .comment('Core build of the alarm cable (strands/diameter mm)');
    table
      .decimal('supply_volts', 4, 1)
      .notNullable()
      .defaultTo(13.7)
      .comment('Auxiliary supply voltage at the panel');
  });
  await knex.raw(`
    alter table systems
      add constraint systems_panel_grade check (panel_grade is null or panel_grade between 1 and 4),
      add constraint systems_sounder_minutes check (sounder_minutes between 1 and 20),
      add constraint systems_resistor_tolerance check (resistor_tolerance in (0.01, 0.02, 0.05, 0.1)),
      add constraint systems_cable_core check (cable_core in ('7/0.2', '16/0.2')),
      add constraint systems_supply_volts check (supply_volts between 9 and 30)
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('systems', (table) => {
    table.dropColumns(
      'panel_grade',
      'panel_quiescent_ma',
      'panel_alarm_ma',
      'sounder_minutes',
      'standby_hours_override',
      'resistor_tolerance',
      'cable_core',
      'supply_volts',
    );
  });
}
