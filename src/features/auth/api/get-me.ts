import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { paths } from '@/config/paths';
import { api, ApiError, clearCsrfToken, setCsrfToken } from '@/lib/api-client';
import { roleGrantSchema } from '@/types/api';

const meSchema = z.object({
  user: z.object({
    id: z.string(),
    email: z.string(),
    displayName: z.string(),
  }),
  roles: z.array(roleGrantSchema),
  csrfToken: z.string().min(1),
});

export type Me = z.infer<typeof meSchema>;

/** The signed-in person, or null when nobody is signed in (the API answers 401). */
export async function getMe({ signal }: { signal?: AbortSignal } = {}): Promise<Me | null> {
  try {
    const me = await api.get(paths.api.me.getHref(), meSchema, { signal });
    setCsrfToken(me.csrfToken);
    return me;
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) {
      clearCsrfToken();
      return null;
    }
    throw error;
  }
}

export const getMeQueryOptions = () =>
  queryOptions({
    queryKey: ['me'],
    queryFn: ({ signal }) => getMe({ signal }),
  });

export const useMe = () => useSuspenseQuery(getMeQueryOptions());
