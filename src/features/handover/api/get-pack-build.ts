import { packBuildSchema, type PackBuild } from '@server/handover/schema';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { api } from '@/lib/api-client';

const buildReplySchema = z.object({ build: packBuildSchema });

/** How often a running build is asked after: often enough that the bar moves smoothly. */
export const BUILD_POLL_MS = 500;

export async function getPackBuild(buildId: string, { signal }: { signal?: AbortSignal } = {}) {
  const { build } = await api.get(
    `/api/handover-builds/${encodeURIComponent(buildId)}`,
    buildReplySchema,
    { signal },
  );
  return build;
}

export const isFinished = (build: PackBuild) =>
  build.status === 'done' || build.status === 'failed';

export const getPackBuildQueryKey = (buildId: string) => ['handover-builds', buildId] as const;

export const getPackBuildQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: getPackBuildQueryKey(buildId),
    queryFn: ({ signal }) => getPackBuild(buildId, { signal }),
    staleTime: 0,
    // Asked again every half second until it is done or has failed.
    refetchInterval: (query) =>
      query.state.data && isFinished(query.state.data) ? false : BUILD_POLL_MS,
    refetchIntervalInBackground: true,
  });

/**
 * Follows one build while there is one: `started` is what the API said when it began (or the
 * draft's last build), and the answer is the latest word on it.
 */
export function usePackBuild(started: PackBuild | null) {
  const query = useQuery({
    ...getPackBuildQueryOptions(started?.id ?? 'none'),
    enabled: started !== null,
    initialData: started ?? undefined,
    initialDataUpdatedAt: 0,
  });
  return { build: started ? (query.data ?? started) : null, error: query.error };
}
