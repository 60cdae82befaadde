import { ROMAN } from '../../calc/grade';
import type { SnapshotBand, SnapshotZone } from '../snapshot';

export type ReadingState = NonNullable<SnapshotZone['measured']>['secureState'];

/** Wardbook's records are for UK installers: dates in the pack read as they do on site. */
const TIME_ZONE = 'Europe/London';

const longDate = new Intl.DateTimeFormat('en-GB', {
  timeZone: TIME_ZONE,
  day: 'numeric',
  month: 'long',
  year: 'numeric',
});
const shortDateTime = new Intl.DateTimeFormat('en-GB', {
  timeZone: TIME_ZONE,
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
  hourCycle: 'h23',
});

/** "2 December 2026". */
export const formatLongDate = (iso: string) => longDate.format(new Date(iso));

/** "2 Dec 2026, 10:14". */
export const formatDateTime = (iso: string) => shortDateTime.format(new Date(iso));

export const romanClass = (environmentalClass: number | null) =>
  environmentalClass === null
    ? 'Not recorded'
    : `Class ${ROMAN[environmentalClass] ?? environmentalClass}`;

export const gradeText = (grade: number | null) =>
  grade === null ? 'Not established' : `Grade ${grade}`;

/**
 * A resistance split into its number and unit, so the number can be set in the monospaced
 * face and the unit in the text face: IBM Plex Mono has no Greek capital omega.
 */
export function ohmsParts(ohms: number): { value: string; unit: string } {
  const tidy = (value: number) => String(Number(value.toPrecision(3)));
  if (ohms >= 1_000_000) return { value: tidy(ohms / 1_000_000), unit: 'MΩ' };
  if (ohms >= 1_000) return { value: tidy(ohms / 1_000), unit: 'kΩ' };
  return { value: tidy(ohms), unit: 'Ω' };
}

export const ohmsText = (ohms: number) => {
  const { value, unit } = ohmsParts(ohms);
  return `${value} ${unit}`;
};

/** Milliamps to amps for the power budget: 185 → "0.185 A". */
export const ampsText = (milliamps: number) => `${Number((milliamps / 1000).toFixed(3))} A`;

export const ampHoursText = (ampHours: number) => `${ampHours.toFixed(2)} Ah`;

/** The trade's words for loop readings (product.md vocabulary). */
export const LOOP_STATE_NAMES: Record<ReadingState, string> = {
  normal: 'Normal',
  alarm: 'Alarm',
  open_circuit: 'Open circuit',
  short_circuit: 'Short circuit',
  out_of_tolerance: 'Out of tolerance',
};

/** Shorter words for the loop gauge's band labels. */
export const BAND_NAMES: Record<SnapshotBand['state'], string> = {
  short_circuit: 'Short',
  normal: 'Normal',
  alarm: 'Alarm',
  open_circuit: 'Open',
};

export const SITING_NAMES = {
  all_clear: 'All clear',
  needs_attention: 'Needs attention',
  not_checked: 'Not checked',
  not_applicable: 'Not applicable',
} as const;

/** EN 50131 access levels as they appear on user-code slots. */
export const accessLevelText = (level: number) =>
  level === 2 ? 'Level 2 (user)' : level === 3 ? 'Level 3 (engineer)' : `Level ${level}`;

/** "C" → "Option C (PD 6662)"; anything longer is shown as recorded. */
export function notificationText(notification: string | null): string {
  if (notification === null) return 'Not recorded';
  return /^[A-F]$/.test(notification.trim())
    ? `Option ${notification.trim()} (PD 6662)`
    : notification;
}

/**
 * A URL cut into lines of at most `maxChars`, breaking after "/", ".", "-", "?", "&" or "=":
 * hyphenation is off (it would insert hyphens into the address) so a long URL would otherwise
 * run off its box. Plex Mono's fixed advance makes a character count a width.
 */
export function breakUrl(url: string, maxChars: number): string[] {
  const pieces = url.match(/[^/.?&=-]*[/.?&=-]?/g)?.filter(Boolean) ?? [url];
  const lines: string[] = [];
  let line = '';
  for (let piece of pieces) {
    if (line.length + piece.length <= maxChars) {
      line += piece;
      continue;
    }
    if (line) lines.push(line);
    while (piece.length > maxChars) {
      lines.push(piece.slice(0, maxChars));
      piece = piece.slice(maxChars);
    }
    line = piece;
  }
  if (line) lines.push(line);
  return lines;
}
