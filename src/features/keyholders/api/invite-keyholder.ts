import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';

import { keyholdersUrl } from '@/features/keyholders/api/get-keyholders';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

const invitationSentSchema = z.object({ invited: z.literal(true) });

export type InviteKeyholderVariables = { siteId: string; keyholderId: string };

/** E-mails the keyholder a link to set a password and sign in as a keyholder. */
export function inviteKeyholder({ siteId, keyholderId }: InviteKeyholderVariables) {
  return api.post(
    `${keyholdersUrl(siteId)}/${encodeURIComponent(keyholderId)}/invitation`,
    undefined,
    invitationSentSchema,
  );
}

export function useInviteKeyholder({
  mutationConfig,
}: {
  mutationConfig?: MutationConfig<z.infer<typeof invitationSentSchema>, InviteKeyholderVariables>;
} = {}) {
  return useMutation({ ...mutationConfig, mutationFn: inviteKeyholder });
}
