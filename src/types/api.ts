import { z } from 'zod';

// Shapes shared by more than one feature. Each endpoint's own response schema lives beside its
// fetcher in src/features/<feature>/api/.

export const roleSchema = z.enum(['engineer', 'office', 'operator', 'homeowner', 'keyholder']);
export type Role = z.infer<typeof roleSchema>;

export const organisationSchema = z.object({
  id: z.string(),
  name: z.string(),
  kind: z.enum(['installer', 'monitoring_centre']),
});
export type Organisation = z.infer<typeof organisationSchema>;

export const roleGrantSchema = z.object({
  role: roleSchema,
  organisation: organisationSchema.nullable(),
});
export type RoleGrant = z.infer<typeof roleGrantSchema>;

export const personSchema = z.object({
  id: z.string(),
  displayName: z.string(),
  email: z.string(),
  roles: z.array(z.string()),
});
export type Person = z.infer<typeof personSchema>;
