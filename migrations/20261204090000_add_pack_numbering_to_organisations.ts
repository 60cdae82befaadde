import type { Knex } from 'knex';

// Handover packs are numbered per installer: an office-set prefix and a gap-free sequence.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('organisations', (table) => {
    table.text('pack_prefix').comment('Letters before every pack number, set by the office');
    table
      .integer('pack_next_number')
      .notNullable()
      .defaultTo(1)
      .comment('The next pack serial; taken and advanced inside the issuing transaction');
  });
  await knex.raw(
    "alter table organisations add constraint organisations_pack_prefix_letters check (pack_prefix ~ '^[A-Z]{2,6}$')",
  );
  // Pack numbers are looked up by anyone on the public verification page: unique across companies.
  await knex.raw(
    'alter table organisations add constraint organisations_pack_prefix_unique unique (pack_prefix)',
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('organisations', (table) => {
    table.dropUnique(['pack_prefix'], 'organisations_pack_prefix_unique');
    table.dropChecks('organisations_pack_prefix_letters');
    table.dropColumns('pack_prefix', 'pack_next_number');
  });
}
