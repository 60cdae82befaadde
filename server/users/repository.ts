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

interface MembershipRow {
  user_id: string;
  role: Role;
  organisation_id: string | null;
  organisation_name: string | null;
  organisation_kind: OrganisationKind | null;
}

function membershipsQuery(db: Knex, userIds: string[]) {
  return db('memberships as m')
    .leftJoin('organisations as o', 'o.id', 'm.organisation_id')
    .whereIn('m.user_id', userIds)
    .orderBy([{ column: 'm.created_at' }, { column: 'm.role' }])
    .select<MembershipRow[]>(
      'm.user_id',
      'm.role',
      'm.organisation_id',
      'o.name as organisation_name',
      'o.kind as organisation_kind',
    );
}

function toMembership(row: MembershipRow): Membership {
  return {
    role: row.role,
    organisation:
      row.organisation_id && row.organisation_name && row.organisation_kind
        ? { id: row.organisation_id, name: row.organisation_name, kind: row.organisation_kind }
        : null,
  };
}

async function withMemberships(db: Knex, user: UserRow | undefined) {
  if (!user) return undefined;
  const memberships = await membershipsQuery(db, [user.id]);
  return {
    id: user.id,
    idpSubject: user.idp_subject,
    email: user.email,
    displayName: user.display_name,
    disabled: user.disabled_at !== null,
    memberships: memberships.map(toMembership),
  } satisfies UserWithMemberships;
}

export async function findUserById(db: Knex, id: string) {
  return withMemberships(db, await db<UserRow>('users').where({ id }).first());
}

export async function findUserBySubject(db: Knex, idpSubject: string) {
  return withMemberships(db, await db<UserRow>('users').where({ idp_subject: idpSubject }).first());
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
