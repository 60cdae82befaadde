import { describe, expect, it } from 'vitest';
import {
  addCalendarMonths,
  daysBetween,
  isLeapYear,
  servicePlan,
  signallingOf,
  SERVICE_PLAN_RULE,
  SERVICE_PLAN_SOURCE,
  type ServicePlanFacts,
} from '../../server/calc/service-plan';

const monitored = { monitoringCentreLinked: true, signallingPaths: [{ toMonitoringCentre: true }] };
const audibleOnly = { monitoringCentreLinked: false, signallingPaths: [] };
const facts = (overrides: Partial<ServicePlanFacts>): ServicePlanFacts => ({
  signalling: monitored,
  inService: null,
  lastPreventiveVisit: null,
  today: '2027-01-15',
  ...overrides,
});

describe('visits a year from the signalling', () => {
  // ../shared/checks.md: "2 preventive visits a year for remotely monitored systems, 1 for
  // audible-only (from memory of PD 6662 / BS 9263 practice)".
  it('plans two visits six months apart for a remotely monitored system', () => {
    const plan = servicePlan(facts({ signalling: monitored }));
    expect(plan).toMatchObject({
      signalling: 'remotely_monitored',
      visitsPerYear: 2,
      intervalMonths: 6,
    });
  });

  it('plans one visit a year for an audible-only system', () => {
    const plan = servicePlan(facts({ signalling: audibleOnly }));
    expect(plan).toMatchObject({
      signalling: 'audible_only',
      visitsPerYear: 1,
      intervalMonths: 12,
    });
  });

  it('names the rule and its source exactly as checks.md records them', () => {
    expect(SERVICE_PLAN_RULE).toBe(
      '2 preventive visits a year for remotely monitored systems, 1 for audible-only',
    );
    expect(SERVICE_PLAN_SOURCE).toBe('from memory of PD 6662 / BS 9263 practice');
    expect(servicePlan(facts({}))).toMatchObject({
      rule: SERVICE_PLAN_RULE,
      source: SERVICE_PLAN_SOURCE,
    });
  });

  // Wardbook's own reading of its records: a path flagged as going to a monitoring centre, or
  // a linked centre, makes the system remotely monitored; disagreements take the monitored side
  // and say which record to check (common practice, no source).
  it('reads the monitoring centre link and the paths, saying which record to fix', () => {
    expect(signallingOf({ monitoringCentreLinked: true, signallingPaths: [] })).toMatchObject({
      signalling: 'remotely_monitored',
      reason: expect.stringMatching(/no signalling path recorded yet/),
    });
    expect(
      signallingOf({
        monitoringCentreLinked: true,
        signallingPaths: [{ toMonitoringCentre: true }, { toMonitoringCentre: true }],
      }).reason,
    ).toMatch(/2 signalling paths go to it/);
    expect(
      signallingOf({
        monitoringCentreLinked: true,
        signallingPaths: [{ toMonitoringCentre: false }],
      }),
    ).toMatchObject({
      signalling: 'remotely_monitored',
      reason: expect.stringMatching(/check the signalling record/),
    });
    expect(
      signallingOf({
        monitoringCentreLinked: false,
        signallingPaths: [{ toMonitoringCentre: true }],
      }),
    ).toMatchObject({
      signalling: 'remotely_monitored',
      reason: expect.stringMatching(/check the site record/),
    });
    expect(
      signallingOf({
        monitoringCentreLinked: false,
        signallingPaths: [{ toMonitoringCentre: false }],
      }),
    ).toMatchObject({ signalling: 'audible_only' });
  });
});

describe('calendar months, clamped to the end of shorter months', () => {
  // The rule the plan uses: same day of the month, or the month's last day where it is shorter
  // (Wardbook's choice for due dates; the outside check is java.time, below).
  // The Gregorian leap-year rule: divisible by 4, except centuries not divisible by 400. The
  // oracle is ECMA-262's DaysInYear, which JavaScript's Date implements (the engine, not us).
  it('knows which years are leap years, as ECMA-262 DaysInYear does', () => {
    expect([2026, 2027, 2028, 2100, 2000, 2400].map(isLeapYear)).toEqual([
      false,
      false,
      true,
      false,
      true,
      true,
    ]);
    for (let year = 1900; year <= 2500; year++) {
      const days = (Date.UTC(year + 1, 0, 1) - Date.UTC(year, 0, 1)) / 86_400_000;
      expect(isLeapYear(year), String(year)).toBe(days === 366);
    }
  });

  it('moves 31 August six months on to the last day of February', () => {
    expect(addCalendarMonths('2026-08-31', 6)).toBe('2027-02-28');
    expect(addCalendarMonths('2027-08-31', 6)).toBe('2028-02-29');
    expect(addCalendarMonths('2099-08-31', 6)).toBe('2100-02-28');
    expect(addCalendarMonths('1999-08-31', 6)).toBe('2000-02-29');
  });

  it('lands 29 February 2028 on 28 February in the next, common, year', () => {
    expect(addCalendarMonths('2028-02-29', 12)).toBe('2029-02-28');
    expect(addCalendarMonths('2028-02-29', 6)).toBe('2028-08-29');
    expect(addCalendarMonths('2027-02-28', 12)).toBe('2028-02-28');
  });

  it('clamps the 31st to 30-day months and keeps days that exist', () => {
    expect(addCalendarMonths('2026-12-31', 6)).toBe('2027-06-30');
    expect(addCalendarMonths('2027-03-31', 6)).toBe('2027-09-30');
    expect(addCalendarMonths('2027-05-31', 6)).toBe('2027-11-30');
    expect(addCalendarMonths('2027-01-15', 6)).toBe('2027-07-15');
    expect(addCalendarMonths('2026-10-30', 6)).toBe('2027-04-30');
  });

  it('crosses year ends both ways', () => {
    expect(addCalendarMonths('2026-07-01', 6)).toBe('2027-01-01');
    expect(addCalendarMonths('2027-01-31', -2)).toBe('2026-11-30');
  });

  // Outside check: java.time.LocalDate.plusMonths / minusMonths document the same rule with
  // worked examples (2007-03-31 plus one month = 2007-04-30; 2007-03-31 minus one month =
  // 2007-02-28), OpenJDK API documentation.
  it('agrees with the worked examples of java.time.LocalDate.plusMonths', () => {
    expect(addCalendarMonths('2007-03-31', 1)).toBe('2007-04-30');
    expect(addCalendarMonths('2007-03-31', -1)).toBe('2007-02-28');
  });

  it('refuses dates that do not exist', () => {
    expect(() => addCalendarMonths('2027-02-29', 6)).toThrow(RangeError);
    expect(() => addCalendarMonths('2027-13-01', 6)).toThrow(RangeError);
    expect(() => addCalendarMonths('27-1-1', 6)).toThrow(RangeError);
  });

  it('counts whole days across a leap day', () => {
    expect(daysBetween('2028-02-28', '2028-03-01')).toBe(2);
    expect(daysBetween('2027-02-28', '2027-03-01')).toBe(1);
    expect(daysBetween('2027-03-01', '2027-02-28')).toBe(-1);
  });
});

describe('the next preventive visit', () => {
  it('counts from handover when no visit has been done', () => {
    const plan = servicePlan(facts({ inService: { on: '2026-08-31', visitsPerYear: 2 } }));
    expect(plan).toMatchObject({
      countsFrom: 'in_service',
      countsFromOn: '2026-08-31',
      nextDueOn: '2027-02-28',
      overdue: false,
      planChange: null,
    });
  });

  it('counts from the last preventive visit, when it was done', () => {
    const plan = servicePlan(
      facts({
        inService: { on: '2025-08-31', visitsPerYear: 2 },
        lastPreventiveVisit: { on: '2026-09-10', visitsPerYear: 2 },
      }),
    );
    expect(plan).toMatchObject({
      countsFrom: 'last_preventive_visit',
      countsFromOn: '2026-09-10',
      nextDueOn: '2027-03-10',
    });
  });

  it('ignores a visit recorded before the system went into service', () => {
    const plan = servicePlan(
      facts({
        inService: { on: '2026-10-01', visitsPerYear: 2 },
        lastPreventiveVisit: { on: '2026-06-01', visitsPerYear: 2 },
      }),
    );
    expect(plan).toMatchObject({ countsFrom: 'in_service', nextDueOn: '2027-04-01' });
  });

  it('has no due date before handover, and is then not overdue', () => {
    expect(servicePlan(facts({}))).toMatchObject({
      countsFrom: null,
      nextDueOn: null,
      overdue: false,
      daysOverdue: 0,
    });
  });

  it('falls due on the leap day for a visit on 29 August 2027', () => {
    const plan = servicePlan(
      facts({ lastPreventiveVisit: { on: '2027-08-29', visitsPerYear: 2 }, today: '2028-02-29' }),
    );
    expect(plan).toMatchObject({ nextDueOn: '2028-02-29', overdue: false, daysOverdue: 0 });
  });
});

describe('overdue', () => {
  const handedOver = { on: '2026-08-31', visitsPerYear: 2 };
  it('is not overdue on the due day itself', () => {
    expect(servicePlan(facts({ inService: handedOver, today: '2027-02-28' }))).toMatchObject({
      overdue: false,
      daysOverdue: 0,
    });
  });

  it('is overdue from the day after, counting the days', () => {
    expect(servicePlan(facts({ inService: handedOver, today: '2027-03-01' }))).toMatchObject({
      overdue: true,
      daysOverdue: 1,
    });
    expect(servicePlan(facts({ inService: handedOver, today: '2027-08-31' }))).toMatchObject({
      overdue: true,
      daysOverdue: 184,
    });
  });
});

describe('when the plan changes', () => {
  const lastVisit = { on: '2026-03-10', visitsPerYear: 1 };

  it('counts a newly monitored system from its last visit with the shorter interval', () => {
    const plan = servicePlan(facts({ lastPreventiveVisit: lastVisit, today: '2026-08-01' }));
    expect(plan).toMatchObject({
      visitsPerYear: 2,
      nextDueOn: '2026-09-10',
      overdue: false,
      planChange: { fromVisitsPerYear: 1, toVisitsPerYear: 2 },
    });
  });

  it('is overdue at once when the last visit is already older than the new interval', () => {
    // Not held back to today: see the comment on servicePlan for why.
    const plan = servicePlan(facts({ lastPreventiveVisit: lastVisit, today: '2026-11-20' }));
    expect(plan).toMatchObject({ nextDueOn: '2026-09-10', overdue: true, daysOverdue: 71 });
    // The same facts a day later give the same due date: it does not move with today.
    expect(
      servicePlan(facts({ lastPreventiveVisit: lastVisit, today: '2026-11-21' })).nextDueOn,
    ).toBe('2026-09-10');
  });

  it('gives a system that stops being monitored the longer interval from its last visit', () => {
    const plan = servicePlan(
      facts({
        signalling: audibleOnly,
        lastPreventiveVisit: { on: '2026-03-10', visitsPerYear: 2 },
        today: '2026-11-20',
      }),
    );
    expect(plan).toMatchObject({
      visitsPerYear: 1,
      nextDueOn: '2027-03-10',
      overdue: false,
      planChange: { fromVisitsPerYear: 2, toVisitsPerYear: 1 },
    });
  });

  it('reports no change when the plan at the milestone is unknown or the same', () => {
    expect(
      servicePlan(facts({ lastPreventiveVisit: { on: '2026-10-01', visitsPerYear: null } }))
        .planChange,
    ).toBeNull();
    expect(
      servicePlan(facts({ inService: { on: '2026-10-01', visitsPerYear: 2 } })).planChange,
    ).toBeNull();
  });
});
