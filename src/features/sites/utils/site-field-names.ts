import type { z } from 'zod';

import type { createSiteSchema } from '@server/sites/schema';

/** The fields a site form edits: the same for a new site and for changing one. */
export type SiteFieldValues = Omit<z.input<typeof createSiteSchema>, 'installerId'>;

/** Field paths the site forms show beside a field; other API messages go in the summary. */
export const SITE_FIELD_NAMES: readonly string[] = [
  'name',
  'premisesType',
  'addressLine1',
  'addressLine2',
  'town',
  'postcode',
  'accessNotes',
  'hazards',
  'riskNotes',
  'requiredGrade',
  'gradeRationale',
  'environmentalClass',
  'policeUrn',
  'urnStatus',
  'monitoringCentreId',
  'monitoringAccount',
] satisfies (keyof SiteFieldValues)[];
