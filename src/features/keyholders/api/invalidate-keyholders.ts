import type { QueryClient } from '@tanstack/react-query';

import { getKeyholdersQueryKey } from '@/features/keyholders/api/get-keyholders';

/**
 * After any change to a call plan: the plan itself, and the summaries that count keyholders or
 * show someone's place in a call order.
 */
export function invalidateKeyholders(queryClient: QueryClient, siteId: string) {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: getKeyholdersQueryKey(siteId) }),
    queryClient.invalidateQueries({ queryKey: ['my', 'homes'] }),
    queryClient.invalidateQueries({ queryKey: ['my', 'keyholdings'] }),
  ]);
}
