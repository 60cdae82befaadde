import type { QueryClient } from '@tanstack/react-query';

import { siteQueryKeys } from '@/lib/site-query-keys';

/**
 * Sections the API works out from the rest of the record: the engineering figures (loop bands,
 * power budget, grade), the commissioning overview with its pre-issue check, and the handover,
 * whose blocking problems and readiness to issue come from that same check.
 */
export const SITE_CHECK_SECTIONS = ['engineering', 'commissioning', 'handover'] as const;

/** After any change to the record, the figures worked out from it are out of date. */
export function refreshSiteChecks(queryClient: QueryClient, siteId: string): void {
  for (const section of SITE_CHECK_SECTIONS) {
    void queryClient.invalidateQueries({ queryKey: siteQueryKeys.section(siteId, section) });
  }
}
