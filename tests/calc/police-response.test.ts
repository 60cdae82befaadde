import { describe, expect, it } from 'vitest';
import { countFalseAlarms, policeEligibility } from '../../server/calc/police-response';

// NPCC policy on police response to security systems, as summarised in ../shared/checks.md:
// a warning after 2 false calls in a rolling 12 months, withdrawal after 3.
const now = new Date('2026-12-02T12:00:00Z');
const daysAgo = (days: number) => new Date(now.getTime() - days * 86_400_000);

describe('false alarms over a rolling twelve months (NPCC policy)', () => {
  it('keeps a site with one false alarm in good standing', () => {
    expect(countFalseAlarms([daysAgo(10)], now)).toMatchObject({
      count: 1,
      standing: 'in_good_standing',
    });
  });

  it('warns after two and calls for withdrawal after three', () => {
    expect(countFalseAlarms([daysAgo(10), daysAgo(200)], now).standing).toBe('warning');
    expect(countFalseAlarms([daysAgo(10), daysAgo(200), daysAgo(300)], now).standing).toBe(
      'withdrawal_due',
    );
  });

  it('forgets a false alarm once it is more than twelve months old', () => {
    const result = countFalseAlarms([daysAgo(10), daysAgo(200), daysAgo(366)], now);
    expect(result).toMatchObject({ count: 2, standing: 'warning' });
    // The oldest counted one (200 days ago) leaves the window a year after it happened.
    expect(result.oldestDropsOffAt?.toISOString().slice(0, 10)).toBe('2027-05-16');
  });

  it('does not count a time in the future', () => {
    expect(countFalseAlarms([new Date('2026-12-03T00:00:00Z')], now).count).toBe(0);
  });
});

describe('when the police may be asked to attend', () => {
  const urn = { police_urn: 'EM/1/26', urn_status: 'active' };
  const event = (category: string, confirmed = false) => ({ category, confirmed, status: 'taken' });

  // NPCC policy (../shared/checks.md): police response needs a URN and is withdrawn after 3
  // false calls; intruder alarms need confirmation (BS 8243 sequential confirmation).
  it('needs a URN that has not been withdrawn', () => {
    expect(
      policeEligibility(event('hold_up'), { police_urn: null, urn_status: 'none' }),
    ).toMatchObject({ eligible: false });
    expect(
      policeEligibility(event('hold_up'), { police_urn: 'EM/1/26', urn_status: 'withdrawn' })
        .reason,
    ).toMatch(/withdrawn/);
    expect(policeEligibility(event('hold_up'), { ...urn, urn_status: 'warning' }).eligible).toBe(
      true,
    );
  });

  it('sends police to a confirmed intruder alarm or a hold-up, not an unconfirmed one', () => {
    expect(policeEligibility(event('burglary'), urn).eligible).toBe(false);
    expect(policeEligibility(event('burglary', true), urn).eligible).toBe(true);
    expect(policeEligibility(event('hold_up'), urn).eligible).toBe(true);
    expect(policeEligibility(event('fault'), urn).eligible).toBe(false);
    expect(policeEligibility(event('burglary', true), null).eligible).toBe(false);
  });
});
