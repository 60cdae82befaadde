import {
  userSlotSchema,
  type createUserSlotSchema,
  type UserSlot,
} from '@server/user-slots/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { userSlotsUrl } from '@/features/user-slots/api/get-user-slots';
import { invalidateUserSlots } from '@/features/user-slots/api/invalidate-user-slots';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type CreateUserSlotVariables = {
  siteId: string;
  data: z.output<typeof createUserSlotSchema>;
};

/** Records who holds a slot; the code for it is set at the keypad, never here. */
export function createUserSlot({ siteId, data }: CreateUserSlotVariables) {
  return api.post(userSlotsUrl(siteId), data, userSlotSchema);
}

export function useCreateUserSlot({
  mutationConfig,
}: { mutationConfig?: MutationConfig<UserSlot, CreateUserSlotVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: createUserSlot,
    onSuccess: async (...args) => {
      await invalidateUserSlots(queryClient, args[1].siteId);
      await onSuccess?.(...args);
    },
  });
}
