import type { UrnStatus } from '@server/sites/schema';

/** Police response status of the site's unique reference number (URN), in plain words. */
export const URN_STATUS_LABELS: Record<UrnStatus, string> = {
  none: 'No URN',
  applied: 'Applied for',
  active: 'Active',
  warning: 'Warning',
  withdrawn: 'Withdrawn',
};

// False-alarm thresholds from NPCC policy (product.md): two bring a warning, three a withdrawal.
export const URN_STATUS_HINTS: Record<UrnStatus, string> = {
  none: 'No police response: audible-only, or monitored without it.',
  applied: 'Applied to the police for a URN; none issued yet.',
  active: 'The police respond to confirmed alarms.',
  warning: 'Police response kept with a warning: two false alarms in a rolling 12 months.',
  withdrawn: 'Police response withdrawn: three false alarms in a rolling 12 months.',
};

export const PREMISES_TYPE_LABELS = { domestic: 'Domestic', commercial: 'Commercial' } as const;
