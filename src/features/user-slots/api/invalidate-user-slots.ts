import type { QueryClient } from '@tanstack/react-query';

import { getUserSlotsQueryKey } from '@/features/user-slots/api/get-user-slots';

/** After any change to the slots: the list, and the home summaries that count them. */
export function invalidateUserSlots(queryClient: QueryClient, siteId: string) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: getUserSlotsQueryKey(siteId) }),
    queryClient.invalidateQueries({ queryKey: ['my', 'homes'] }),
  ]);
}
