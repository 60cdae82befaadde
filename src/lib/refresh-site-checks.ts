import type { QueryClient } from '@tanstack/react-query';

import { siteQueryKeys } from '@/lib/site-query-keys';

/**
 * Sections the API works out from the rest of the record: the engineering figures (loop bands,
 * power budget, grade) and the commissioning overview with its pre-issue check.
 */
export const SITE_CHECK_SECTIONS = ['engineering', 'commissioning'] as const;

/** After any change to the record, the figures worked out from it are out of date. */
export function refreshSiteChecks(queryClient: QueryClient, siteId: string): void {
  for (const section of SITE_CHECK_SECTIONS) {
    void queryClient.invalidateQueries({ queryKey: siteQueryKeys.section(siteId, section) });
  }
}
