import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { LOOP_WIRINGS } from '@server/zones/schema';
import { api } from '@/lib/api-client';
import { bandSchema, powerBudgetFiguresSchema } from '@/lib/calc-result-schemas';
import { siteQueryKeys } from '@/lib/site-query-keys';

const zoneEngineeringSchema = z.object({
  zoneId: z.string(),
  number: z.number(),
  location: z.string(),
  design: z.object({
    wiring: z.enum(LOOP_WIRINGS),
    tamperOhms: z.number().nullable(),
    alarmOhms: z.number().nullable(),
    tolerance: z.number(),
    cableOhms: z.object({ min: z.number(), max: z.number() }),
  }),
  bands: z.array(bandSchema),
  problems: z.array(z.string()),
});
export type ZoneEngineering = z.infer<typeof zoneEngineeringSchema>;

const siteEngineeringSchema = z.object({
  zones: z.array(zoneEngineeringSchema),
  power: z.discriminatedUnion('available', [
    z.object({ available: z.literal(false), reason: z.string() }),
    powerBudgetFiguresSchema.extend({ available: z.literal(true) }),
  ]),
  grade: z.object({
    grade: z.number().nullable(),
    limitedBy: z.array(z.string()),
    ungraded: z.array(z.string()),
  }),
  requiredGrade: z.number(),
  environmentalMismatches: z.array(
    z.object({
      label: z.string(),
      location: z.string(),
      environmentalClass: z.number(),
      required: z.number(),
      why: z.string(),
    }),
  ),
});
export type SiteEngineering = z.infer<typeof siteEngineeringSchema>;

// JSON has no infinity: open-ended band edges arrive as null.
const responseSchema = z.object({ engineering: siteEngineeringSchema.nullable() });

/**
 * What the calculations say about the site's recorded system: each zone's loop bands, the power
 * budget, the system grade and environmental class mismatches. Null until the system is recorded.
 */
export async function getSiteEngineering(
  siteId: string,
  { signal }: { signal?: AbortSignal } = {},
) {
  const { engineering } = await api.get(
    `/api/sites/${encodeURIComponent(siteId)}/engineering`,
    responseSchema,
    { signal },
  );
  return engineering;
}

export const getSiteEngineeringQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: siteQueryKeys.section(siteId, 'engineering'),
    queryFn: ({ signal }) => getSiteEngineering(siteId, { signal }),
    // Worked out from the whole record (zones, devices, site grade): fetched afresh on each visit.
    staleTime: 0,
  });

export const useSiteEngineering = (siteId: string) =>
  useSuspenseQuery(getSiteEngineeringQueryOptions(siteId));
