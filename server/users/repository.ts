import type { Knex } from 'knex';
import type { OrganisationKind, Role } from './roles';

export interface Membership {
  role: Role;
  organisation: { id: string; name: string; kind: OrganisationKind } | null;
}

export interface UserWithMemberships {
  id: string;
  idpSubject: string;
  email: string;
  displayName: string;
  disabled: boolean;
  memberships: Membership[];
}

interface UserRow {
  id: string;
  idp_subject: string;
  email: string;
  display_name: string;
  disabled_at: Date | null;
}

/** A user and their memberships in one query; every request that has a session makes it. */
function userWithMemberships(db: Knex) {
  return db('users as u').select(
    'u.id',
    'u.idp_subject',
    'u.email',
    'u.display_name',
    'u.disabled_at',
    db.raw(`coalesce((
      select json_agg(json_build_object(
               'role', m.role,
               'organisation', case when o.id is null then null
                 else json_build_object('id', o.id, 'name', o.name, 'kind', o.kind) end)
             order by m.created_at, m.role)
        from memberships m left join organisations o on o.id = m.organisation_id
       where m.user_id = u.id), '[]'::json) as memberships`),
  );
}

function toUser(
  row: (UserRow & { memberships: Membership[] }) | undefined,
): UserWithMemberships | undefined {
  if (!row) return undefined;
  return {
    id: row.id,
    idpSubject: row.idp_subject,
    email: row.email,
    displayName: row.display_name,
    disabled: row.disabled_at !== null,
    memberships: row.memberships,
  };
}

export async function findUserById(db: Knex, id: string) {
  return toUser(await userWithMemberships(db).where('u.id', id).first());
}

export async function findUserBySubject(db: Knex, idpSubject: string) {
  return toUser(await userWithMemberships(db).where('u.idp_subject', idpSubject).first());
}

/** Keeps the name and e-mail the IdP vouches for in step with Wardbook's copy. */
export async function refreshUserProfile(
  db: Knex,
  id: string,
  profile: { email: string; displayName: string },
) {
  await db('users')
    .where({ id })
    .andWhere((q) =>
      q.whereNot('email', profile.email).orWhereNot('display_name', profile.displayName),
    )
    .update({ email: profile.email, display_name: profile.displayName, updated_at: db.fn.now() });
}

export interface OrganisationMember {
  id: string;
  displayName: string;
  email: string;
  roles: Role[];
}

/** Everyone holding a role in the organisation, with the roles they hold there. */
export async function listOrganisationMembers(
  db: Knex,
  organisationId: string,
  roles?: readonly Role[],
): Promise<OrganisationMember[]> {
  const rows = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.organisation_id', organisationId)
    .whereNull('u.disabled_at')
    .modify((q) => {
      if (roles) q.whereIn('m.role', roles);
    })
    .groupBy('u.id', 'u.display_name', 'u.email')
    .orderBy('u.display_name')
    .select<{ id: string; display_name: string; email: string; roles: Role[] }[]>(
      'u.id',
      'u.display_name',
      'u.email',
      db.raw('array_agg(m.role order by m.role) as roles'),
    );
  return rows.map((row) => ({
    id: row.id,
    displayName: row.display_name,
    email: row.email,
    roles: row.roles,
  }));
}
