import { signingRequestSchema, type SigningRequest } from '@server/handover/schema';
import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import type { NamedSignature } from '@/features/handover/utils/signature-form';

const signingRequestUrl = (requestId: string) =>
  `/api/my/signing-requests/${encodeURIComponent(requestId)}`;

/** A request to countersign a handover, as the homeowner it was sent to sees it. */
export async function getSigningRequest(
  requestId: string,
  { signal }: { signal?: AbortSignal } = {},
) {
  return api.get(signingRequestUrl(requestId), signingRequestSchema, { signal });
}

export const getSigningRequestQueryKey = (requestId: string) =>
  ['my', 'signing-requests', requestId] as const;

export const getSigningRequestQueryOptions = (requestId: string) =>
  queryOptions({
    queryKey: getSigningRequestQueryKey(requestId),
    queryFn: ({ signal }) => getSigningRequest(requestId, { signal }),
    staleTime: 0,
  });

export const useSigningRequest = (requestId: string) =>
  useSuspenseQuery(getSigningRequestQueryOptions(requestId));

export type SignRequestVariables = { requestId: string; signature: NamedSignature };

/** The homeowner countersigns, accepting the variations listed. */
export function signRequest({ requestId, signature }: SignRequestVariables) {
  return api.post(`${signingRequestUrl(requestId)}/sign`, signature, signingRequestSchema);
}

export function useSignRequest(
  mutationConfig: MutationConfig<SigningRequest, SignRequestVariables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig;
  return useMutation({
    ...restConfig,
    mutationFn: signRequest,
    onSuccess: async (request, variables, ...rest) => {
      queryClient.setQueryData(getSigningRequestQueryKey(variables.requestId), request);
      await onSuccess?.(request, variables, ...rest);
    },
  });
}
