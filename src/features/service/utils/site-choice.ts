import type { SiteListItem } from '@server/sites/schema';

/** A site as the booking form's picker lists it. */
export type SiteChoice = { id: string; label: string };

export const siteChoiceOf = (
  site: Pick<SiteListItem, 'id' | 'reference' | 'name' | 'town'>,
): SiteChoice => ({
  id: site.id,
  label: `${site.reference} · ${site.name}, ${site.town}`,
});
