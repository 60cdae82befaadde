import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { api } from '@/lib/api-client';

export const alertSchema = z.object({
  eventId: z.string(),
  siteName: z.string(),
  town: z.string(),
  address: z.array(z.string()),
  category: z.string(),
  confirmed: z.boolean(),
  raisedAt: z.string(),
  callOutStatus: z.string(),
  myResponse: z.enum(['attending', 'cannot_attend']).nullable(),
  respondedAt: z.string().nullable(),
  closedAt: z.string().nullable(),
  outcome: z.string().nullable(),
});
export type Alert = z.infer<typeof alertSchema>;

const myAlertsSchema = z.object({ active: z.array(alertSchema), past: z.array(alertSchema) });
export type MyAlerts = z.infer<typeof myAlertsSchema>;

/** Alarms at the sites this keyholder holds keys for: the ones going on, and earlier ones. */
export function getMyAlerts({ signal }: { signal?: AbortSignal } = {}) {
  return api.get('/api/my/alerts', myAlertsSchema, { signal });
}

export const getMyAlertsQueryOptions = () =>
  queryOptions({
    queryKey: ['my', 'alerts'] as const,
    queryFn: ({ signal }) => getMyAlerts({ signal }),
    // Keyholders have no live feed: a new alert shows within half a minute of opening the page,
    // and the text message reaches them sooner anyway.
    refetchInterval: 30_000,
    refetchOnWindowFocus: true,
    staleTime: 10_000,
  });

/** Not a suspense query: the homes a keyholder holds keys for must show even if this fails. */
export const useMyAlerts = () => useQuery(getMyAlertsQueryOptions());
