import type { Knex } from 'knex';
import { listAuditForOrganisation, type AuditEntry } from '../audit/repository';
import { NotFoundError } from '../http/errors';
import {
  listOrganisationMembers,
  type Membership,
  type OrganisationMember,
  type UserWithMemberships,
} from '../users/repository';
import type { Role } from '../users/roles';

type Organisation = NonNullable<Membership['organisation']>;

export type RoleHome =
  | { role: 'engineer'; organisation: Organisation; colleagues: OrganisationMember[] }
  | {
      role: 'office';
      organisation: Organisation;
      members: OrganisationMember[];
      recentAudit: AuditEntry[];
    }
  | { role: 'operator'; organisation: Organisation; operators: OrganisationMember[] }
  | { role: 'homeowner'; displayName: string }
  | { role: 'keyholder'; displayName: string };

function organisationFor(user: UserWithMemberships, role: Role): Organisation {
  const organisation = user.memberships.find((m) => m.role === role)?.organisation;
  if (!organisation) throw new NotFoundError('No organisation is linked to this role.');
  return organisation;
}

/** The summary each role's home page opens with. Later issues add sites, events and visits. */
export async function roleHome(db: Knex, user: UserWithMemberships, role: Role): Promise<RoleHome> {
  switch (role) {
    case 'engineer': {
      const organisation = organisationFor(user, role);
      const colleagues = await listOrganisationMembers(db, organisation.id, ['engineer', 'office']);
      return { role, organisation, colleagues };
    }
    case 'office': {
      const organisation = organisationFor(user, role);
      const [members, recentAudit] = await Promise.all([
        listOrganisationMembers(db, organisation.id),
        listAuditForOrganisation(db, organisation.id, 25),
      ]);
      return { role, organisation, members, recentAudit };
    }
    case 'operator': {
      const organisation = organisationFor(user, role);
      const operators = await listOrganisationMembers(db, organisation.id, ['operator']);
      return { role, organisation, operators };
    }
    case 'homeowner':
    case 'keyholder':
      return { role, displayName: user.displayName };
  }
}
