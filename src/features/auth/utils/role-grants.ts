import type { Me } from '@/features/auth/api/get-me';
import type { Role, RoleGrant } from '@/types/api';

/** One entry per role, in the order the API listed them, with every organisation for it. */
export type RoleEntry = { role: Role; organisationNames: string[] };

export function hasRole(me: Me, role: Role): boolean {
  return me.roles.some((grant) => grant.role === role);
}

export function firstRole(me: Me): Role | undefined {
  return me.roles[0]?.role;
}

export function roleEntries(grants: readonly RoleGrant[]): RoleEntry[] {
  const entries = new Map<Role, RoleEntry>();
  for (const grant of grants) {
    const entry = entries.get(grant.role) ?? { role: grant.role, organisationNames: [] };
    if (grant.organisation && !entry.organisationNames.includes(grant.organisation.name)) {
      entry.organisationNames.push(grant.organisation.name);
    }
    entries.set(grant.role, entry);
  }
  return [...entries.values()];
}
