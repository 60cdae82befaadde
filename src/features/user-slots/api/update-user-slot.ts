import {
  userSlotSchema,
  type updateUserSlotSchema,
  type UserSlot,
} from '@server/user-slots/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { userSlotsUrl } from '@/features/user-slots/api/get-user-slots';
import { invalidateUserSlots } from '@/features/user-slots/api/invalidate-user-slots';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type UpdateUserSlotVariables = {
  siteId: string;
  slotId: string;
  data: z.output<typeof updateUserSlotSchema>;
};

/** Renames the holder, changes dates or areas, or switches the slot off and on again. */
export function updateUserSlot({ siteId, slotId, data }: UpdateUserSlotVariables) {
  return api.patch(`${userSlotsUrl(siteId)}/${encodeURIComponent(slotId)}`, data, userSlotSchema);
}

export function useUpdateUserSlot({
  mutationConfig,
}: { mutationConfig?: MutationConfig<UserSlot, UpdateUserSlotVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: updateUserSlot,
    onSuccess: async (...args) => {
      await invalidateUserSlots(queryClient, args[1].siteId);
      await onSuccess?.(...args);
    },
  });
}
