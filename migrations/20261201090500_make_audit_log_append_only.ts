import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    create function audit_log_refuse_change() returns trigger
    language plpgsql as $$
    begin
      raise exception 'audit_log is append-only' using errcode = 'insufficient_privilege';
    end $$;
    create trigger audit_log_append_only
      before update or delete on audit_log
      for each row execute function audit_log_refuse_change();
    create trigger audit_log_no_truncate
      before truncate on audit_log
      for each statement execute function audit_log_refuse_change();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    drop trigger audit_log_no_truncate on audit_log;
    drop trigger audit_log_append_only on audit_log;
    drop function audit_log_refuse_change();
  `);
}
