import { QueryClient, type DefaultOptions, type UseMutationOptions } from '@tanstack/react-query';

import { ApiError, NetworkError } from '@/lib/api-client';

const maxNetworkRetries = 1;
const maxServerErrorRetries = 1;

// A 4xx will not change by asking again; a dropped connection or a 5xx might.
function shouldRetry(failureCount: number, error: Error): boolean {
  if (error instanceof NetworkError) return failureCount < maxNetworkRetries;
  if (error instanceof ApiError && error.status >= 500) return failureCount < maxServerErrorRetries;
  return false;
}

export const queryConfig = {
  queries: {
    staleTime: 60_000,
    refetchOnWindowFocus: false,
    retry: shouldRetry,
  },
  mutations: {
    retry: false,
  },
} satisfies DefaultOptions;

export function createQueryClient(): QueryClient {
  return new QueryClient({ defaultOptions: queryConfig });
}

/** Options a caller may add to a feature's mutation hook; the feature owns the mutationFn. */
export type MutationConfig<Result, Variables = void> = Omit<
  UseMutationOptions<Result, Error, Variables>,
  'mutationFn'
>;
