import { userSlotListSchema } from '@server/user-slots/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

export const userSlotsUrl = (siteId: string) =>
  `/api/sites/${encodeURIComponent(siteId)}/user-slots`;

/** Who holds each user-code slot on the panel. The codes themselves are never in Wardbook. */
export async function getUserSlots(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  const { slots } = await api.get(userSlotsUrl(siteId), userSlotListSchema, { signal });
  return [...slots].sort((a, b) => a.slot - b.slot);
}

export const getUserSlotsQueryKey = (siteId: string) => siteQueryKeys.section(siteId, 'user-slots');

export const getUserSlotsQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: getUserSlotsQueryKey(siteId),
    queryFn: ({ signal }) => getUserSlots(siteId, { signal }),
  });

export const useUserSlots = (siteId: string) => useSuspenseQuery(getUserSlotsQueryOptions(siteId));
