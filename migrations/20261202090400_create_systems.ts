import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('systems', (table) => {
    table.comment('The intruder-alarm system fitted at a site: panel, power and signalling.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('site_id').notNullable().unique().references('sites.id').onDelete('CASCADE');
    table.text('control_panel').notNullable().defaultTo('').comment('Make and model, free text');
    table.text('firmware').notNullable().defaultTo('');
    table.text('panel_location').notNullable().defaultTo('');
    table
      .enu('psu_type', ['A', 'B', 'C'])
      .comment('EN 50131-6 power supply type: A and B charge a battery, C has none');
    table.decimal('battery_ah', 6, 2).comment('Fitted standby battery capacity, ampere-hours');
    table
      .enu('notification', ['A', 'B', 'C', 'D', 'E', 'F'])
      .comment('EN 50131-1 notification option (warning devices and ATS) chosen for the grade');
    table.boolean('mains_failure_signalled').notNullable().defaultTo(false);
    table
      .integer('version')
      .notNullable()
      .defaultTo(1)
      .comment('Panel, power and signalling edits');
    table.integer('zones_version').notNullable().defaultTo(1).comment('Zone schedule edits');
    table.integer('devices_version').notNullable().defaultTo(1).comment('Device list edits');
    table.timestamps(true, true);
  });
  await knex.raw(
    'alter table systems add constraint systems_battery_ah check (battery_ah is null or battery_ah > 0)',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('systems');
}
