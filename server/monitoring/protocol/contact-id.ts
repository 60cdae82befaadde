/**
 * Contact ID (SIA DC-05) as carried in DC-09's ADM-CID frames, and the SIA-DCS codes most
 * panels send, both mapped to the categories the monitoring centre works by. Pure functions.
 *
 * A Contact ID message is ACCT MT Q XYZ GG CCC S: account, message type (18 or 98), qualifier
 * (1 new event, 3 restore, 6 still present), event code, group or partition, zone or user,
 * and a checksum digit.
 */

export type SignalCategory =
  'fire' | 'hold_up' | 'burglary' | 'tamper' | 'fault' | 'open_close' | 'test' | 'other';

export type Qualifier = 'new' | 'restore' | 'status';

export interface ContactIdEvent {
  qualifier: Qualifier;
  /** Three digits, e.g. "130". */
  code: string;
  partition: number;
  /** Zone number for alarms, user number for opening and closing. */
  zoneOrUser: number;
  category: SignalCategory;
}

const QUALIFIERS: Record<string, Qualifier> = { '1': 'new', '3': 'restore', '6': 'status' };

/** Event codes by range (SIA DC-05; the ranges as listed in spandsp's ademco_contactid.c). */
export function contactIdCategory(code: string): SignalCategory {
  const value = Number(code);
  if (!/^\d{3}$/.test(code)) return 'other';
  if (value === 137 || value === 144 || value === 145 || (value >= 380 && value <= 389))
    return 'tamper';
  if (value >= 110 && value <= 118) return 'fire';
  if (value >= 120 && value <= 129) return 'hold_up';
  if (value >= 130 && value <= 139) return 'burglary';
  if (value >= 140 && value <= 149) return 'burglary';
  if (value >= 300 && value <= 399) return 'fault';
  if (value >= 400 && value <= 499) return 'open_close';
  if (value >= 600 && value <= 699) return 'test';
  return 'other';
}

/**
 * The checksum digit: each digit counts its value, except 0 which counts 10; the total of all
 * sixteen digits must be a multiple of 15, and a checksum of 15 is sent as F.
 * `digits` is the fifteen digits before the checksum (hex digits B–F allowed in the account).
 */
export function contactIdChecksum(digits: string): string {
  const clean = digits.replace(/\s+/g, '');
  if (!/^[0-9A-F]{15}$/i.test(clean)) throw new RangeError('Contact ID needs 15 digits before S');
  let sum = 0;
  for (const digit of clean) {
    const value = Number.parseInt(digit, 16);
    sum += value === 0 ? 10 : value;
  }
  const check = (15 - (sum % 15)) % 15;
  return check === 0 ? 'F' : check.toString(16).toUpperCase();
}

export function isValidContactIdMessage(message: string): boolean {
  const clean = message.replace(/\s+/g, '');
  if (!/^[0-9A-F]{16}$/i.test(clean)) return false;
  return contactIdChecksum(clean.slice(0, 15)) === clean[15]!.toUpperCase();
}

/**
 * The data of an ADM-CID frame: `#acct|Q XYZ GG CCC`, spaces optional, e.g.
 * `#1234|1131 01 015` (new burglary, partition 1, zone 15). The account may be left out,
 * leaving `|Q XYZ GG CCC` (as decrypted frames give it). Undefined when it is not that.
 */
export function parseAdmCidData(
  data: string,
): (ContactIdEvent & { account: string | null }) | undefined {
  const match = /^(?:(?:#([0-9A-F]{3,16}))?\|)?([136])\s?(\d{3})\s?(\d{2})\s?(\d{3})$/i.exec(
    data.trim(),
  );
  if (!match) return undefined;
  const [, account, qualifier, code, partition, zone] = match;
  return {
    account: account ?? null,
    qualifier: QUALIFIERS[qualifier!]!,
    code: code!,
    partition: Number(partition),
    zoneOrUser: Number(zone),
    category: contactIdCategory(code!),
  };
}

/** SIA-DCS two-letter codes: the first letter names the family, the second the event. */
const SIA_CODES: Record<string, { category: SignalCategory; qualifier: Qualifier }> = {
  BA: { category: 'burglary', qualifier: 'new' },
  BR: { category: 'burglary', qualifier: 'restore' },
  BB: { category: 'burglary', qualifier: 'status' },
  FA: { category: 'fire', qualifier: 'new' },
  FR: { category: 'fire', qualifier: 'restore' },
  PA: { category: 'hold_up', qualifier: 'new' },
  PR: { category: 'hold_up', qualifier: 'restore' },
  HA: { category: 'hold_up', qualifier: 'new' },
  HR: { category: 'hold_up', qualifier: 'restore' },
  TA: { category: 'tamper', qualifier: 'new' },
  TR: { category: 'tamper', qualifier: 'restore' },
  AT: { category: 'fault', qualifier: 'new' },
  AR: { category: 'fault', qualifier: 'restore' },
  YT: { category: 'fault', qualifier: 'new' },
  YR: { category: 'fault', qualifier: 'restore' },
  OP: { category: 'open_close', qualifier: 'new' },
  CL: { category: 'open_close', qualifier: 'new' },
  RP: { category: 'test', qualifier: 'new' },
  RX: { category: 'test', qualifier: 'new' },
};

export interface SiaEvent {
  account: string | null;
  code: string;
  zoneOrUser: number | null;
  area: number | null;
  category: SignalCategory;
  qualifier: Qualifier;
}

/** The data of a SIA-DCS frame, e.g. `#12345A|NFA129`, `#1234|Nri1/BA05` or `|Nri1/CL501`. */
export function parseSiaDcsData(data: string): SiaEvent | undefined {
  const match = /^(?:(?:#([0-9A-F]{3,16}))?\|)?N(?:ri(\d{1,3})\/?)?([A-Z]{2})(\d{0,4})/i.exec(
    data.trim(),
  );
  if (!match) return undefined;
  const [, account, area, code, zone] = match;
  const known = SIA_CODES[code!.toUpperCase()];
  return {
    account: account ?? null,
    code: code!.toUpperCase(),
    zoneOrUser: zone ? Number(zone) : null,
    area: area ? Number(area) : null,
    category: known?.category ?? 'other',
    qualifier: known?.qualifier ?? 'new',
  };
}
