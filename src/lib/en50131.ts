import { ROMAN_CLASSES } from '@server/schema/fields';

/*
 * Plain-words summaries of EN 50131-1's security grades and environmental classes, written in
 * Wardbook's own words (paraphrased from memory of EN 50131-1). They help choose; the standard
 * decides.
 */

export const GRADE_SUMMARIES: Record<number, string> = {
  1: 'Low risk: an intruder with little knowledge of alarms and only simple, ready tools.',
  2: 'Low to medium risk: some knowledge of alarms and a general range of tools. Most homes.',
  3: 'Medium to high risk: an intruder who knows alarm systems and brings portable electronic kit.',
  4: 'High risk: an intruder able to plan in detail, with the means to defeat or substitute parts.',
};

export const ENVIRONMENTAL_CLASS_SUMMARIES: Record<number, string> = {
  1: 'Indoor, heated',
  2: 'Indoor, unheated',
  3: 'Outdoor, sheltered',
  4: 'Outdoor, exposed',
};

/** Environmental classes are written I–IV; the API stores 1–4. */
export function romanClass(environmentalClass: number): string {
  return ROMAN_CLASSES[environmentalClass - 1] ?? String(environmentalClass);
}
