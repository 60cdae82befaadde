import type { Knex } from 'knex';

// The cable between panel and detector adds to every loop reading, and drops the volts the
// detector gets; both calculations need the run.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('zones', (table) => {
    table.decimal('cable_metres', 7, 1).comment('Length of the cable run from the panel, metres');
    table
      .smallint('cores_per_leg')
      .notNullable()
      .defaultTo(1)
      .comment('Cores doubled up on each leg of the loop');
  });
  await knex.raw(`
    alter table zones
      add constraint zones_cable_metres check (cable_metres is null or (cable_metres >= 0 and cable_metres <= 2000)),
      add constraint zones_cores_per_leg check (cores_per_leg between 1 and 4)
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('zones', (table) => {
    table.dropColumns('cable_metres', 'cores_per_leg');
  });
}
