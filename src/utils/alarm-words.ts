import { OUTCOME_LABELS, type Outcome } from '@server/monitoring/schema';

/**
 * Words for what a signal or event was about, shared by the operator's, keyholder's, homeowner's
 * and office's screens. Hold-up and set/unset are the trade's words (EN 50131); the rest are
 * Wardbook's own plain English.
 */
export const CATEGORY_LABELS: Record<string, string> = {
  fire: 'Fire alarm',
  hold_up: 'Hold-up alarm',
  burglary: 'Intruder alarm',
  tamper: 'Tamper',
  fault: 'Fault',
  open_close: 'Set or unset',
  test: 'Test signal',
  other: 'Other signal',
};

export function categoryLabel(category: string): string {
  return CATEGORY_LABELS[category] ?? category.replaceAll('_', ' ');
}

/** An intruder alarm confirmed by a second detector (BS 8243) reads differently. */
export function eventLabel(category: string, confirmed: boolean): string {
  const label = categoryLabel(category);
  return confirmed && category === 'burglary' ? `${label}, confirmed` : label;
}

function isKnownOutcome(outcome: string): outcome is Outcome {
  return Object.hasOwn(OUTCOME_LABELS, outcome);
}

/** How an event ended; an outcome this client does not know yet is shown in readable form. */
export function outcomeLabel(outcome: string | null): string {
  if (outcome === null) return 'Not closed';
  if (isKnownOutcome(outcome)) return OUTCOME_LABELS[outcome];
  const words = outcome.replaceAll('_', ' ');
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** Outcomes that count against the site's police response (NPCC policy). */
export function isFalseAlarmOutcome(outcome: string | null): boolean {
  return outcome?.startsWith('false_alarm') ?? false;
}
