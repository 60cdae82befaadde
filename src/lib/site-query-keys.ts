/**
 * Query keys for a site and everything recorded under it. They are hierarchical so that one
 * invalidation reaches every view that depends on it (`['sites']` refreshes lists, details and
 * sections alike), and they live here so a save in one feature can refresh another's view without
 * the features importing each other.
 */
export const siteQueryKeys = {
  all: ['sites'] as const,
  lists: () => ['sites', 'list'] as const,
  list: (filters: object) => ['sites', 'list', filters] as const,
  detail: (siteId: string) => ['sites', 'detail', siteId] as const,
  /** One section of a site's record: 'system', 'zones', 'devices', 'keyholders', … */
  section: (siteId: string, section: string) => ['sites', siteId, section] as const,
};
