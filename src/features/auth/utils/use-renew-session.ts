import { useCallback } from 'react';

import { getMe } from '@/features/auth/api/get-me';

/**
 * Asks the API who is signed in, which also renews this page's security token, without touching
 * the cached answer (so an ended session does not take the page away in the middle of work).
 * True only when the same person is still, or again, signed in: records kept on a phone must
 * never be sent under someone else's session.
 */
export function useRenewSession(userId: string | undefined): () => Promise<boolean> {
  return useCallback(async () => {
    try {
      return userId !== undefined && (await getMe())?.user.id === userId;
    } catch {
      return false;
    }
  }, [userId]);
}
