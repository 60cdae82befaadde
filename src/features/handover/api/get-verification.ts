import { verificationSchema } from '@server/handover/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';

export const verifyApiUrl = (packNumber: string) => `/api/verify/${encodeURIComponent(packNumber)}`;

/** A pack's public record: its status, hash and seal. Needs no sign-in. */
export async function getVerification(
  packNumber: string,
  { signal }: { signal?: AbortSignal } = {},
) {
  return api.get(verifyApiUrl(packNumber), verificationSchema, { signal });
}

export const getVerificationQueryKey = (packNumber: string) => ['verify', packNumber] as const;

export const getVerificationQueryOptions = (packNumber: string) =>
  queryOptions({
    queryKey: getVerificationQueryKey(packNumber),
    queryFn: ({ signal }) => getVerification(packNumber, { signal }),
    // A pack can be revoked or superseded at any time; a check should say what is true now.
    staleTime: 0,
  });

export const useVerification = (packNumber: string) =>
  useSuspenseQuery(getVerificationQueryOptions(packNumber));
