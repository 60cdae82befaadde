import { siteQueryKeys } from '@/lib/site-query-keys';

/**
 * Query keys for the service screens. The company's schedule and overdue list sit under
 * `['service']`, so one invalidation after a booking or a move refreshes both; a site's plan sits
 * with the site's other sections, so a change to the site's signalling refreshes it too.
 */
export const serviceQueryKeys = {
  all: ['service'] as const,
  schedules: () => ['service', 'visits'] as const,
  schedule: (range: object) => ['service', 'visits', range] as const,
  overdue: () => ['service', 'overdue'] as const,
  faults: () => ['service', 'faults'] as const,
  plan: (siteId: string) => siteQueryKeys.section(siteId, 'service-plan'),
};
