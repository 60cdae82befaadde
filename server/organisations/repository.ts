import type { Knex } from 'knex';
import type { OrganisationKind } from '../users/roles';

export interface Organisation {
  id: string;
  name: string;
  kind: OrganisationKind;
}

export async function findOrganisation(db: Knex, id: string): Promise<Organisation | undefined> {
  return db('organisations').where({ id }).first<Organisation | undefined>('id', 'name', 'kind');
}

/** How many active people hold each role in the organisation. */
export async function countMembersByRole(db: Knex, organisationId: string) {
  const rows = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.organisation_id', organisationId)
    .whereNull('u.disabled_at')
    .groupBy('m.role')
    .select<{ role: string; count: number }[]>('m.role', db.raw('count(*)::int as count'));
  return Object.fromEntries(rows.map((row) => [row.role, row.count]));
}
