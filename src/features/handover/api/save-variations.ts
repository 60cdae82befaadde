import { handoverStateSchema, type HandoverState } from '@server/handover/schema';

import { handoverUrl } from '@/features/handover/api/get-handover';
import { useHandoverMutation } from '@/features/handover/api/use-handover-mutation';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type SaveVariationsVariables = {
  siteId: string;
  variations: string[];
  /** The draft's version the person edited; the API answers 409 if it has moved on. */
  version: number | null;
};

/** Replaces the written variations. A changed list clears the customer's signature. */
export function saveVariations({ siteId, variations, version }: SaveVariationsVariables) {
  return api.put(`${handoverUrl(siteId)}/variations`, { variations, version }, handoverStateSchema);
}

export const useSaveVariations = (
  mutationConfig?: MutationConfig<HandoverState, SaveVariationsVariables>,
) => useHandoverMutation(saveVariations, mutationConfig);
