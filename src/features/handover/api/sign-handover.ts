import { handoverStateSchema, type HandoverState } from '@server/handover/schema';

import { handoverUrl } from '@/features/handover/api/get-handover';
import { useHandoverMutation } from '@/features/handover/api/use-handover-mutation';
import { api, apiRequest } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import type { NamedSignature } from '@/features/handover/utils/signature-form';

export type EngineerSignatureVariables = { siteId: string; image: string };

/** The signed-in engineer signs the handover (the name is their own, from their account). */
export function signAsEngineer({ siteId, image }: EngineerSignatureVariables) {
  return api.post(`${handoverUrl(siteId)}/signatures/engineer`, { image }, handoverStateSchema);
}

export const useSignAsEngineer = (
  mutationConfig?: MutationConfig<HandoverState, EngineerSignatureVariables>,
) => useHandoverMutation(signAsEngineer, mutationConfig);

export type CustomerSignatureVariables = { siteId: string; signature: NamedSignature };

/** The customer signs in person, on the engineer's phone or tablet. */
export function signAsCustomer({ siteId, signature }: CustomerSignatureVariables) {
  return api.post(`${handoverUrl(siteId)}/signatures/customer`, signature, handoverStateSchema);
}

export const useSignAsCustomer = (
  mutationConfig?: MutationConfig<HandoverState, CustomerSignatureVariables>,
) => useHandoverMutation(signAsCustomer, mutationConfig);

export type ClearSignaturesVariables = { siteId: string };

/** Removes both signatures, to start signing again. */
export function clearSignatures({ siteId }: ClearSignaturesVariables) {
  return apiRequest(`${handoverUrl(siteId)}/signatures`, {
    method: 'DELETE',
    schema: handoverStateSchema,
  });
}

export const useClearSignatures = (
  mutationConfig?: MutationConfig<HandoverState, ClearSignaturesVariables>,
) => useHandoverMutation(clearSignatures, mutationConfig);

export type SigningRequestVariables = { siteId: string; homeownerUserId: string };

/** E-mails a homeowner a link to read the variations and countersign on their own phone. */
export function sendSigningRequest({ siteId, homeownerUserId }: SigningRequestVariables) {
  return api.post(
    `${handoverUrl(siteId)}/signing-request`,
    { homeownerUserId },
    handoverStateSchema,
  );
}

export const useSendSigningRequest = (
  mutationConfig?: MutationConfig<HandoverState, SigningRequestVariables>,
) => useHandoverMutation(sendSigningRequest, mutationConfig);
