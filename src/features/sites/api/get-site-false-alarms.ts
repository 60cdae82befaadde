import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

const siteFalseAlarmsSchema = z.object({
  count: z.number(),
  standing: z.enum(['in_good_standing', 'warning', 'withdrawal_due']),
  oldestDropsOffAt: z.string().nullable(),
  events: z.array(
    z.object({
      id: z.string(),
      at: z.string(),
      category: z.string(),
      outcome: z.string().nullable(),
      closedAt: z.string().nullable(),
    }),
  ),
  /** What brings police response back once false alarms have withdrawn it (NPCC policy). */
  reinstatement: z.object({
    needed: z.boolean(),
    rule: z.string(),
    source: z.string(),
    met: z.boolean(),
    items: z.array(z.object({ item: z.string(), met: z.boolean(), words: z.string() })),
  }),
});
export type SiteFalseAlarms = z.infer<typeof siteFalseAlarmsSchema>;

/** The site's false alarms over the rolling twelve months, as the police count them. */
export function getSiteFalseAlarms(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(`/api/sites/${encodeURIComponent(siteId)}/false-alarms`, siteFalseAlarmsSchema, {
    signal,
  });
}

export const getSiteFalseAlarmsQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: siteQueryKeys.section(siteId, 'false-alarms'),
    queryFn: ({ signal }) => getSiteFalseAlarms(siteId, { signal }),
  });

/** Not a suspense query: the site's details must open even if the count cannot be had. */
export const useSiteFalseAlarms = (siteId: string) =>
  useQuery(getSiteFalseAlarmsQueryOptions(siteId));
