/**
 * Query keys for the monitoring screens, hierarchical so that one change from the live stream
 * refreshes the queue (both tabs) with `lists()` and one event's screen with `detail(id)`.
 */
export const monitoringQueryKeys = {
  all: ['monitoring'] as const,
  events: () => ['monitoring', 'events'] as const,
  lists: () => ['monitoring', 'events', 'list'] as const,
  list: (status: 'active' | 'closed') => ['monitoring', 'events', 'list', status] as const,
  detail: (eventId: string) => ['monitoring', 'events', 'detail', eventId] as const,
  figures: () => ['monitoring', 'figures'] as const,
};
