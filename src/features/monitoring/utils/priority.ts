/**
 * The queue's priorities in words. The API orders by number (1 hold-up and fire, 2 confirmed
 * intruder, 3 intruder, 4 tamper, 5 fault, 6 anything else); these are Wardbook's own words.
 */
export const PRIORITY_WORDS: Record<number, string> = {
  1: 'Highest',
  2: 'Very high',
  3: 'High',
  4: 'Medium',
  5: 'Low',
  6: 'Lowest',
};

export function priorityWords(priority: number): string {
  return PRIORITY_WORDS[priority] ?? `Priority ${priority}`;
}

/** Filled marks out of five: the eye finds the heaviest rows first, without needing colour. */
export function priorityWeight(priority: number): number {
  return Math.min(5, Math.max(0, 6 - priority));
}

/** The state an event's category stands for: alarms in vermilion, tamper and faults in amber. */
export function categoryTone(category: string): 'alarm' | 'fault' | 'info' {
  if (category === 'fire' || category === 'hold_up' || category === 'burglary') return 'alarm';
  if (category === 'tamper' || category === 'fault') return 'fault';
  return 'info';
}
