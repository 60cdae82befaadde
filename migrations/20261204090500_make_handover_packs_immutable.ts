import type { Knex } from 'knex';

// An issued pack is evidence: no one, not even the app's own database user, may change it.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    create function handover_packs_refuse_change() returns trigger
    language plpgsql as $$
    begin
      raise exception 'issued handover packs cannot be changed; issue a new revision'
        using errcode = 'insufficient_privilege';
    end $$;
    create trigger handover_packs_frozen
      before update or delete on handover_packs
      for each row execute function handover_packs_refuse_change();
    create trigger handover_packs_no_truncate
      before truncate on handover_packs
      for each statement execute function handover_packs_refuse_change();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    drop trigger handover_packs_no_truncate on handover_packs;
    drop trigger handover_packs_frozen on handover_packs;
    drop function handover_packs_refuse_change();
  `);
}
