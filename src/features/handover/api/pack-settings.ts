import { packSettingsSchema, type PackSettings } from '@server/handover/schema';
import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

const packSettingsUrl = '/api/organisation/pack-settings';

/** The company's pack-number prefix, the next number, and its sealing keys old and current. */
export async function getPackSettings({ signal }: { signal?: AbortSignal } = {}) {
  return api.get(packSettingsUrl, packSettingsSchema, { signal });
}

export const getPackSettingsQueryKey = () => ['organisation', 'pack-settings'] as const;

export const getPackSettingsQueryOptions = () =>
  queryOptions({
    queryKey: getPackSettingsQueryKey(),
    queryFn: ({ signal }) => getPackSettings({ signal }),
  });

export const usePackSettings = () => useSuspenseQuery(getPackSettingsQueryOptions());

function usePackSettingsMutation<Variables>(
  mutationFn: (variables: Variables) => Promise<PackSettings>,
  mutationConfig: MutationConfig<PackSettings, Variables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig;
  return useMutation({
    ...restConfig,
    mutationFn,
    onSuccess: async (settings, ...rest) => {
      queryClient.setQueryData(getPackSettingsQueryKey(), settings);
      await onSuccess?.(settings, ...rest);
    },
  });
}

export type UpdatePackSettingsVariables = { prefix: string };

/** Changes the prefix of pack numbers from the next pack on; issued packs keep theirs. */
export function updatePackSettings({ prefix }: UpdatePackSettingsVariables) {
  return api.put(packSettingsUrl, { prefix }, packSettingsSchema);
}

export const useUpdatePackSettings = (
  mutationConfig?: MutationConfig<PackSettings, UpdatePackSettingsVariables>,
) => usePackSettingsMutation(updatePackSettings, mutationConfig);

/** Makes a new sealing key for packs from now on; the old one is retired, not deleted. */
export function rotateSealKey() {
  return api.post('/api/organisation/seal-keys/rotate', undefined, packSettingsSchema);
}

export const useRotateSealKey = (mutationConfig?: MutationConfig<PackSettings, void>) =>
  usePackSettingsMutation(rotateSealKey, mutationConfig);
