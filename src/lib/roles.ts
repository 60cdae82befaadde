import { useMatches } from 'react-router-dom';

import { paths } from '@/config/paths';
import { roleSchema, type Role } from '@/types/api';

export const roleLabels: Record<Role, string> = {
  engineer: 'Engineer',
  office: 'Office',
  operator: 'Operator',
  homeowner: 'Homeowner',
  keyholder: 'Keyholder',
};

/**
 * Company and monitoring-centre staff work at desks with dense tables; homeowners and keyholders
 * mostly use a phone, so their pages are a single column with large targets.
 */
export type RoleLayout = 'workspace' | 'personal';

export const roleLayouts: Record<Role, RoleLayout> = {
  engineer: 'workspace',
  office: 'workspace',
  operator: 'workspace',
  homeowner: 'personal',
  keyholder: 'personal',
};

export function isRole(value: unknown): value is Role {
  return roleSchema.safeParse(value).success;
}

export function roleHomeHref(role: Role): string {
  return paths.home[role].getHref();
}

/** Names a role as people read it; roles this client does not know yet are shown as sent. */
export function describeRole(role: string): string {
  return isRole(role) ? roleLabels[role] : role;
}

/** Route `handle` carried by each role's home so shared layouts know which role is in view. */
export type RoleRouteHandle = { role: Role };

function isRoleRouteHandle(handle: unknown): handle is RoleRouteHandle {
  return typeof handle === 'object' && handle !== null && 'role' in handle && isRole(handle.role);
}

/** The role whose pages are on screen, taken from the deepest matched route that names one. */
export function useRoleInView(): Role | undefined {
  const matches = useMatches();
  const handle = matches
    .map((match) => match.handle)
    .filter(isRoleRouteHandle)
    .at(-1);
  return handle?.role;
}
