import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { paths } from '@/config/paths';
import { api } from '@/lib/api-client';
import { organisationSchema, personSchema, type Role } from '@/types/api';

const auditEntrySchema = z.object({
  id: z.string(),
  occurredAt: z.string(),
  action: z.string(),
  summary: z.string(),
  actorName: z.string().nullable(),
});

const roleHomeSchemas = {
  engineer: z.object({
    role: z.literal('engineer'),
    organisation: organisationSchema,
    colleagues: z.array(personSchema),
  }),
  office: z.object({
    role: z.literal('office'),
    organisation: organisationSchema,
    members: z.array(personSchema),
    recentAudit: z.array(auditEntrySchema),
  }),
  operator: z.object({
    role: z.literal('operator'),
    organisation: organisationSchema,
    operators: z.array(personSchema),
  }),
  homeowner: z.object({
    role: z.literal('homeowner'),
    displayName: z.string(),
  }),
  keyholder: z.object({
    role: z.literal('keyholder'),
    displayName: z.string(),
  }),
} satisfies Record<Role, z.ZodType>;

export type AuditEntry = z.infer<typeof auditEntrySchema>;
export type RoleHome<R extends Role> = z.infer<(typeof roleHomeSchemas)[R]>;

/** The summary shown on one role's home page. The API answers 403 if the role is not held. */
export async function getRoleHome<R extends Role>(
  role: R,
  { signal }: { signal?: AbortSignal } = {},
): Promise<RoleHome<R>> {
  // TypeScript cannot tie a generic key to its entry in a union of schemas; each schema's literal
  // `role` makes the pairing hold at run time.
  const schema = roleHomeSchemas[role] as unknown as z.ZodType<RoleHome<R>>;
  return api.get(paths.api.roleHome.getHref(role), schema, { signal });
}

export const getRoleHomeQueryOptions = <R extends Role>(role: R) =>
  queryOptions({
    queryKey: ['homes', role],
    queryFn: ({ signal }) => getRoleHome(role, { signal }),
  });

export const useRoleHome = <R extends Role>(role: R) =>
  useSuspenseQuery(getRoleHomeQueryOptions(role));
