import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';

import { paths } from '@/config/paths';
import { api, clearCsrfToken } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

const signOutResultSchema = z.object({ redirectTo: z.string().min(1) });

export type SignOutResult = z.infer<typeof signOutResultSchema>;

/** Ends the Wardbook session; the reply says where to send the browser to end the provider's. */
export function signOut(): Promise<SignOutResult> {
  return api.post(paths.auth.logout.getHref(), undefined, signOutResultSchema);
}

// The target comes from our own API, but a javascript: or data: URL must never be followed.
function safeNavigationTarget(target: string): string {
  try {
    const url = new URL(target, window.location.origin);
    return url.protocol === 'https:' || url.protocol === 'http:'
      ? url.href
      : paths.landing.getHref();
  } catch {
    return paths.landing.getHref();
  }
}

type UseSignOutOptions = {
  mutationConfig?: MutationConfig<SignOutResult>;
};

export function useSignOut({ mutationConfig }: UseSignOutOptions = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};

  return useMutation({
    ...restConfig,
    mutationFn: signOut,
    onSuccess: (result, ...rest) => {
      clearCsrfToken();
      queryClient.clear();
      window.location.assign(safeNavigationTarget(result.redirectTo));
      return onSuccess?.(result, ...rest);
    },
  });
}
