import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('memberships', (table) => {
    table.comment('Which roles a user holds, and for staff roles in which organisation.');
    table.uuid('id').primary().defaultTo(knex.fn.uuid());
    table.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    table.enu('role', ['engineer', 'office', 'homeowner', 'keyholder', 'operator']).notNullable();
    table
      .uuid('organisation_id')
      .references('organisations.id')
      .onDelete('CASCADE')
      .comment('Set for engineer, office and operator; empty for homeowner and keyholder');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['organisation_id', 'role']);
  });
  await knex.raw(`
    alter table memberships
      add constraint memberships_staff_have_organisation
        check ((role in ('homeowner', 'keyholder')) = (organisation_id is null)),
      add constraint memberships_unique
        unique nulls not distinct (user_id, role, organisation_id)
  `);
  // Engineers and office staff work for installers, operators for monitoring centres; a
  // check constraint cannot see the organisation's kind, so a trigger guards it.
  await knex.raw(`
    create function memberships_check_organisation_kind() returns trigger
    language plpgsql as $$
    declare
      organisation_kind text;
    begin
      if new.organisation_id is null then
        return new;
      end if;
      select kind into organisation_kind from organisations where id = new.organisation_id;
      if (new.role in ('engineer', 'office') and organisation_kind <> 'installer')
         or (new.role = 'operator' and organisation_kind <> 'monitoring_centre') then
        raise exception 'role % does not belong in a % organisation', new.role, organisation_kind
          using errcode = 'check_violation';
      end if;
      return new;
    end $$;
    create trigger memberships_organisation_kind
      before insert or update on memberships
      for each row execute function memberships_check_organisation_kind();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('memberships');
  await knex.raw('drop function memberships_check_organisation_kind()');
}
