import type { z } from 'zod';

import { siteListQuerySchema } from '@server/sites/schema';

export type SiteListFilters = z.output<typeof siteListQuerySchema>;

const filterNames = [
  'page',
  'pageSize',
  'sort',
  'order',
  'q',
  'grade',
  'urnStatus',
  'monitored',
  'engineerId',
] as const satisfies readonly (keyof SiteListFilters)[];

/**
 * Reads the list's state from the address bar. A hand-edited or outdated value is dropped rather
 * than refused, so an old bookmark still opens the list.
 */
export function readSiteListFilters(searchParams: URLSearchParams): SiteListFilters {
  const raw: Record<string, string> = {};
  for (const name of filterNames) {
    const value = searchParams.get(name);
    if (value !== null && value.trim() !== '') raw[name] = value;
  }
  const parsed = siteListQuerySchema.safeParse(raw);
  if (parsed.success) return parsed.data;
  for (const issue of parsed.error.issues) {
    const name = issue.path[0];
    if (typeof name === 'string') delete raw[name];
  }
  return siteListQuerySchema.safeParse(raw).data ?? siteListQuerySchema.parse({});
}

const defaults = siteListQuerySchema.parse({});

/** Writes the list's state back as search parameters, leaving out whatever is at its default. */
export function siteListSearchParams(filters: SiteListFilters): URLSearchParams {
  const params = new URLSearchParams();
  for (const name of filterNames) {
    const value = filters[name];
    if (value === undefined || value === '' || value === defaults[name]) continue;
    params.set(name, String(value));
  }
  return params;
}

/** The same state as the API's query string, which always carries paging and order. */
export function siteListApiQuery(filters: SiteListFilters): string {
  const params = new URLSearchParams();
  for (const name of filterNames) {
    const value = filters[name];
    if (value !== undefined && value !== '') params.set(name, String(value));
  }
  return params.toString();
}
