import { randomInt } from 'node:crypto';

/** Letters and digits that cannot be mistaken for one another when read off a phone. */
const REFERENCE_ALPHABET = '23456789ABCDEFGHJKMNPQRSTUVWXYZ';

/** A short reference carried in each text, unique per message. */
export function newMessageReference(): string {
  return Array.from(
    { length: 6 },
    () => REFERENCE_ALPHABET[randomInt(REFERENCE_ALPHABET.length)],
  ).join('');
}

export type AlertCategory = 'burglary' | 'fire' | 'hold_up' | 'tamper' | 'fault' | 'other';

const ALERT_WORDS: Record<AlertCategory, string> = {
  burglary: 'intruder alarm',
  fire: 'fire alarm',
  hold_up: 'hold-up alarm',
  tamper: 'tamper signal',
  fault: 'fault signal',
  other: 'alarm signal',
};

export interface AlertText {
  centreName: string;
  category: AlertCategory;
  confirmed: boolean;
  /** The site's name as the keyholder knows it, never its street address. */
  siteName: string;
  town: string;
  raisedAt: Date;
  reference: string;
}

const londonTime = new Intl.DateTimeFormat('en-GB', {
  timeZone: 'Europe/London',
  hour: '2-digit',
  minute: '2-digit',
});

/**
 * The text a keyholder receives. Texts go to phones that may be lost or read by others, so they
 * carry no street address, no alarm or user codes and no zone details: only enough for the
 * keyholder to know which premises and what to do (common practice, no source). Plain ASCII,
 * so it stays in the GSM 7-bit alphabet and fits two segments.
 */
export function composeAlertText(alert: AlertText): string {
  const what = `${ALERT_WORDS[alert.category]}${alert.category === 'burglary' && alert.confirmed ? ' (confirmed)' : ''}`;
  return [
    `${alert.centreName}: ${what} at ${alert.siteName}, ${alert.town}, ${londonTime.format(alert.raisedAt)}.`,
    'Can you attend? Reply 1 if you are on your way, 2 if you cannot.',
    'Do not go in if you see signs of forced entry: wait for police at a safe distance.',
    `Ref ${alert.reference}`,
  ].join(' ');
}

export type KeyholderReply = 'attending' | 'cannot_attend';

/** "1" or "2", however it was typed: " 1.", "1 on my way", "2 sorry". Anything else is unclear. */
export function readKeyholderReply(body: string): KeyholderReply | null {
  const first = /^\s*([12])(?![0-9])/.exec(body);
  if (!first) return null;
  return first[1] === '1' ? 'attending' : 'cannot_attend';
}
