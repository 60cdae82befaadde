import { describe, expect, it } from 'vitest';
import {
  composeAlertText,
  newMessageReference,
  readKeyholderReply,
} from '../../server/monitoring/callout/compose';
import { describeSignal } from '../../server/monitoring/describe';
import { segmentCount } from '../../server/fakes/twilio/segments';

const alert = {
  centreName: 'Halden Watch',
  category: 'burglary' as const,
  confirmed: true,
  siteName: 'Marsh residence',
  town: 'Thornbury Vale',
  raisedAt: new Date('2026-12-02T02:14:00Z'),
  reference: 'K7Q2XM',
};

describe('the text a keyholder receives', () => {
  it('says what, where (by name and town) and when, and asks for 1 or 2', () => {
    const text = composeAlertText(alert);
    expect(text).toContain('intruder alarm (confirmed) at Marsh residence, Thornbury Vale, 02:14');
    expect(text).toContain('Reply 1');
    expect(text).toContain('Ref K7Q2XM');
  });

  it('carries the forced-entry caution and fits two GSM-7 segments of plain ASCII', () => {
    const text = composeAlertText(alert);
    expect(text).toMatch(/Do not go in if you see signs of forced entry/);
    // GSM 03.38: plain ASCII letters and punctuation used here are all in the 7-bit alphabet.
    expect(text).toMatch(/^[\x20-\x7e]+$/);
    expect(segmentCount(text)).toBeLessThanOrEqual(2);
  });

  it('shows the local time in winter and summer (Europe/London)', () => {
    expect(composeAlertText({ ...alert, raisedAt: new Date('2026-07-01T02:14:00Z') })).toContain(
      '03:14',
    );
  });

  it('has references from an alphabet without look-alike characters', () => {
    for (let i = 0; i < 200; i += 1) expect(newMessageReference()).toMatch(/^[2-9A-HJKMNP-Z]{6}$/);
  });
});

describe('reading a keyholder’s reply', () => {
  it.each([
    ['1', 'attending'],
    [' 1.', 'attending'],
    ['1 on my way', 'attending'],
    ['2', 'cannot_attend'],
    ['2 sorry, away', 'cannot_attend'],
  ])('reads %j as %s', (body, expected) => {
    expect(readKeyholderReply(body)).toBe(expected);
  });

  it.each(['12', '3', 'yes', '', 'one'])('does not guess at %j', (body) => {
    expect(readKeyholderReply(body)).toBeNull();
  });
});

describe('signals in words', () => {
  // SIA DC-05 Contact ID: 4xx with qualifier 1 is an opening (unset), 3 a closing (set).
  it('tells sets from unsets in Contact ID and SIA-DCS', () => {
    expect(
      describeSignal({ category: 'open_close', qualifier: 'new', eventCode: '401', zoneOrUser: 3 }),
    ).toBe('Unset by user 3');
    expect(
      describeSignal({
        category: 'open_close',
        qualifier: 'restore',
        eventCode: '401',
        zoneOrUser: 3,
      }),
    ).toBe('Set by user 3');
    expect(
      describeSignal({ category: 'open_close', qualifier: 'new', eventCode: 'CL', zoneOrUser: 2 }),
    ).toBe('Set by user 2');
  });

  it('names alarms and their restores', () => {
    expect(
      describeSignal({
        category: 'burglary',
        qualifier: 'restore',
        eventCode: '130',
        zoneOrUser: 4,
      }),
    ).toBe('Intruder alarm cleared');
    expect(
      describeSignal({ category: 'test', qualifier: 'new', eventCode: '602', zoneOrUser: null }),
    ).toBe('Periodic test');
  });
});
