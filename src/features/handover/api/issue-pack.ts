import { packBuildSchema, type PackBuild } from '@server/handover/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { getPackBuildQueryKey } from '@/features/handover/api/get-pack-build';
import { handoverUrl } from '@/features/handover/api/get-handover';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

const buildStartedSchema = z.object({ build: packBuildSchema });

export type IssuePackVariables = { siteId: string };

/** Starts building the pack; the API answers at once (202) with the build to follow. */
export async function issuePack({ siteId }: IssuePackVariables): Promise<PackBuild> {
  const { build } = await api.post(`${handoverUrl(siteId)}/issue`, undefined, buildStartedSchema);
  return build;
}

export function useIssuePack(mutationConfig: MutationConfig<PackBuild, IssuePackVariables> = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig;
  return useMutation({
    ...restConfig,
    mutationFn: issuePack,
    onSuccess: async (build, ...rest) => {
      queryClient.setQueryData(getPackBuildQueryKey(build.id), build);
      await onSuccess?.(build, ...rest);
    },
  });
}
