import { z } from 'zod';

export const ROLES = ['engineer', 'office', 'homeowner', 'keyholder', 'operator'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

/** Roles that act for a company and must sign in with a second factor. */
export const STAFF_ROLES: readonly Role[] = ['engineer', 'office', 'operator'];

export type OrganisationKind = 'installer' | 'monitoring_centre';
