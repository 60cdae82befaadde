import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { preIssueCheckSchema, walkTestSchema } from '@server/commissioning/schema';
import { zoneSchema } from '@server/zones/schema';
import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

export const SYSTEM_TEST_KINDS = ['sounders', 'signalling', 'battery'] as const;
export type SystemTestKind = (typeof SYSTEM_TEST_KINDS)[number];

const commissioningSchema = z.object({
  zones: z.array(
    z.object({
      zone: zoneSchema,
      lastWalkTest: walkTestSchema.nullable(),
      siting: z
        .object({
          allClear: z.boolean(),
          answers: z.record(z.string(), z.boolean()),
          checkedAt: z.string(),
        })
        .nullable(),
    }),
  ),
  systemTests: z.array(
    z.object({
      kind: z.enum(SYSTEM_TEST_KINDS),
      passed: z.boolean(),
      // Stored as the test's own fields; read defensively, as older records may lack some.
      details: z.unknown(),
      testedBy: z.string().nullable(),
      testedAt: z.string(),
    }),
  ),
  check: preIssueCheckSchema,
});
export type Commissioning = z.infer<typeof commissioningSchema>;
export type CommissioningZone = Commissioning['zones'][number];
export type SystemTestRecord = Commissioning['systemTests'][number];

/** Every zone with its last walk test and siting check, the system tests, and the pre-issue check. */
export async function getCommissioning(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(`/api/sites/${encodeURIComponent(siteId)}/commissioning`, commissioningSchema, {
    signal,
  });
}

export const getCommissioningQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: siteQueryKeys.section(siteId, 'commissioning'),
    queryFn: ({ signal }) => getCommissioning(siteId, { signal }),
    // The pre-issue check reads the whole record (keyholders, URN, tests): fetched on each visit.
    staleTime: 0,
  });

export const useCommissioning = (siteId: string) =>
  useSuspenseQuery(getCommissioningQueryOptions(siteId));
