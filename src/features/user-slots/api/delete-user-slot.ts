import { useMutation, useQueryClient } from '@tanstack/react-query';

import { userSlotsUrl } from '@/features/user-slots/api/get-user-slots';
import { invalidateUserSlots } from '@/features/user-slots/api/invalidate-user-slots';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type DeleteUserSlotVariables = { siteId: string; slotId: string };

/** Deletes the record of a slot (installer staff only; homeowners deactivate instead). */
export function deleteUserSlot({ siteId, slotId }: DeleteUserSlotVariables) {
  return api.delete(`${userSlotsUrl(siteId)}/${encodeURIComponent(slotId)}`);
}

export function useDeleteUserSlot({
  mutationConfig,
}: { mutationConfig?: MutationConfig<undefined, DeleteUserSlotVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: deleteUserSlot,
    onSuccess: async (...args) => {
      await invalidateUserSlots(queryClient, args[1].siteId);
      await onSuccess?.(...args);
    },
  });
}
