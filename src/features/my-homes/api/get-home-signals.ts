import { infiniteQueryOptions, useSuspenseInfiniteQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { getMyHomesQueryKey } from '@/features/my-homes/api/get-my-homes';
import { api } from '@/lib/api-client';

const homeSignalSchema = z.object({
  id: z.string(),
  at: z.string(),
  category: z.string(),
  qualifier: z.enum(['new', 'restore', 'status']),
  description: z.string(),
  zone: z.number().nullable(),
  zoneName: z.string().nullable(),
});
export type HomeSignal = z.infer<typeof homeSignalSchema>;

const homeSignalPageSchema = z.object({
  signals: z.array(homeSignalSchema),
  nextBefore: z.string().nullable(),
  falseAlarms: z.object({
    count: z.number(),
    standing: z.enum(['in_good_standing', 'warning', 'withdrawal_due']),
    oldestDropsOffAt: z.string().nullable(),
  }),
});
export type HomeSignalPage = z.infer<typeof homeSignalPageSchema>;

/** One page of the signals the home's system sent, newest first; `before` pages back. */
export function getHomeSignals(
  siteId: string,
  before: string | null,
  { signal }: { signal?: AbortSignal } = {},
) {
  const query = before ? `?before=${encodeURIComponent(before)}` : '';
  return api.get(
    `/api/my/homes/${encodeURIComponent(siteId)}/signals${query}`,
    homeSignalPageSchema,
    { signal },
  );
}

export const getHomeSignalsQueryOptions = (siteId: string) =>
  infiniteQueryOptions({
    queryKey: [...getMyHomesQueryKey(), siteId, 'signals'] as const,
    queryFn: ({ pageParam, signal }) => getHomeSignals(siteId, pageParam, { signal }),
    initialPageParam: null as string | null,
    getNextPageParam: (lastPage) => lastPage.nextBefore,
  });

export const useHomeSignals = (siteId: string) =>
  useSuspenseInfiniteQuery(getHomeSignalsQueryOptions(siteId));
