import { siteListSchema } from '@server/sites/schema';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

/** Enough to pick from; more than this and the office types a few more letters. */
export const SITE_CHOICES_PAGE_SIZE = 25;

/** The company's sites matching a search, for the booking form's site picker. */
export function getSiteChoices(search: string, { signal }: { signal?: AbortSignal } = {}) {
  const query = new URLSearchParams({ pageSize: String(SITE_CHOICES_PAGE_SIZE) });
  if (search) query.set('q', search);
  return api.get(`/api/sites?${query}`, siteListSchema, { signal });
}

export const getSiteChoicesQueryOptions = (search: string) =>
  queryOptions({
    // Under the sites list key, so a new or renamed site refreshes the picker as well.
    queryKey: siteQueryKeys.list({ q: search, pageSize: SITE_CHOICES_PAGE_SIZE, for: 'picker' }),
    queryFn: ({ signal }) => getSiteChoices(search, { signal }),
    placeholderData: keepPreviousData,
  });

export const useSiteChoices = (search: string) => useQuery(getSiteChoicesQueryOptions(search));
