import type { Locator, Page } from 'playwright-core';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { addCalendarMonths } from '../../server/calc/service-plan';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-scenario';
import { wcagViolations } from '../setup/axe';
import { signInAs } from '../setup/browser-sign-in';
import { closeTestDb, testDb } from '../setup/database';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const browser = useChromium();
const db = testDb();
const { apiUrl } = inject('stack');
const DESK = { width: 1600, height: 900 };
afterAll(closeTestDb);

// The plan's rule and source as the API states them (server/calc/service-plan.ts, from
// ../shared/checks.md): shown word for word, never reworded.
const PLAN_RULE = '2 preventive visits a year for remotely monitored systems, 1 for audible-only';
const PLAN_SOURCE = 'from memory of PD 6662 / BS 9263 practice';

const mainText = (page: Page) => page.locator('main').innerText();

// The schedule's days and times are the UK's, whatever zone the browser or this machine is in.
const ukClock = new Intl.DateTimeFormat('en-CA', {
  timeZone: 'Europe/London',
  year: 'numeric',
  month: '2-digit',
  day: '2-digit',
  hour: '2-digit',
  minute: '2-digit',
  hourCycle: 'h23',
});
/** "YYYY-MM-DD HH:MM" on UK clocks. */
const onUkClock = (instant: Date) => ukClock.format(instant).replace(',', '');
const ukToday = () => onUkClock(new Date()).slice(0, 10);
/** How the calendar names a day for screen readers: "Wednesday 10 March 2027". */
const longDay = (day: string) =>
  new Intl.DateTimeFormat('en-GB', {
    weekday: 'long',
    day: 'numeric',
    month: 'long',
    year: 'numeric',
    timeZone: 'UTC',
  })
    .format(new Date(`${day}T00:00:00Z`))
    .replace(',', '');

/** The calendar's cell for one day, found by the full date it names for screen readers. */
const calendarDay = (page: Page, day: string): Locator =>
  page
    .getByRole('list', { name: /day by day/ })
    .locator(':scope > li')
    .filter({ hasText: longDay(day) });

async function engineerId(): Promise<string> {
  const engineer = DEMO_ACCOUNTS.find((account) => account.role === 'engineer')!;
  const row = await db('users').whereRaw('lower(email) = ?', [engineer.email]).first('id');
  return row.id;
}

describe('the office service schedule', () => {
  it('books a visit with an engineer, finds it in the list and the calendar, moves it, and lists the overdue', async () => {
    const today = ukToday();
    const nextMonth = addCalendarMonths(`${today.slice(0, 7)}-01`, 1).slice(0, 7);
    const bookedDay = `${nextMonth}-10`;
    const movedDay = `${nextMonth}-12`;
    const site = await db('sites').where({ reference: 'S-0005' }).first('id', 'reference', 'name');
    // Another demo site whose last preventive visit was done more than a year ago: overdue
    // under either plan.
    const lateSite = await db('sites')
      .where({ reference: 'S-0006' })
      .first('id', 'reference', 'name');
    const lastVisitOn = addCalendarMonths(today, -14);
    await db('service_visits').insert({
      site_id: lateSite.id,
      kind: 'preventive',
      status: 'done',
      due_date: lastVisitOn,
      completed_at: `${lastVisitOn}T11:00:00Z`,
      plan_visits_per_year: 2,
    });
    const callumId = await engineerId();

    const context = await browser().newContext({ viewport: DESK });
    const page = await context.newPage();
    await signInAs(page, db, 'office');
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Service schedule' })
      .click();
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toBe('Service schedule');
    expect(await wcagViolations(page)).toEqual([]);

    // --- Book: a day already past is refused beside its field, and nothing typed is lost -------
    await page.getByRole('button', { name: 'Book a visit' }).click();
    const booking = page.getByRole('form', { name: 'Book a visit' });
    // Opening the form moves focus to it.
    await expect
      .poll(() => page.evaluate(() => document.activeElement?.textContent))
      .toBe('Book a visit');
    await booking.getByLabel('Find a site').fill(site.reference);
    await expect
      .poll(() =>
        booking.getByLabel('Site', { exact: true }).locator(`option[value="${site.id}"]`).count(),
      )
      .toBe(1);
    await booking.getByLabel('Site', { exact: true }).selectOption(site.id);
    await booking.getByLabel('Visit day').fill(addCalendarMonths(today, -1));
    await booking.getByLabel('Time').fill('09:30');
    await booking.getByLabel('Engineer').selectOption(callumId);
    await booking.getByRole('button', { name: 'Book the visit' }).click();
    await expect
      .poll(() => booking.getByRole('alert').innerText())
      .toContain('The booking was not saved');
    await expect
      .poll(() => booking.innerText())
      .toContain('A visit cannot be booked for a day that has passed.');
    await expect
      .poll(() => booking.getByLabel('Visit day').getAttribute('aria-invalid'))
      .toBe('true');
    expect(await booking.getByLabel('Site', { exact: true }).inputValue()).toBe(site.id);
    expect(await booking.getByLabel('Time').inputValue()).toBe('09:30');
    expect(await booking.getByLabel('Engineer').inputValue()).toBe(callumId);
    expect(await wcagViolations(page)).toEqual([]);
    expect(await db('service_visits').where({ site_id: site.id }).first()).toBeUndefined();

    await booking.getByLabel('Visit day').fill(bookedDay);
    await booking.getByRole('button', { name: 'Book the visit' }).click();
    await expect
      .poll(() => mainText(page))
      .toContain(`Booked: Preventive visit at ${site.reference}`);
    const stored = await db('service_visits').where({ site_id: site.id }).first();
    expect(stored).toMatchObject({
      kind: 'preventive',
      status: 'scheduled',
      engineer_id: callumId,
      version: 1,
    });
    expect(onUkClock(stored.scheduled_for)).toBe(`${bookedDay} 09:30`);

    // --- The list, grouped by engineer, on the booked month -------------------------------------
    await expect
      .poll(() => page.getByRole('heading', { level: 2, name: /^Visits in / }).textContent())
      .toMatch(new RegExp(`^Visits in \\w+ ${nextMonth.slice(0, 4)}$`));
    const callumGroup = page.getByRole('region', { name: 'Visits for Callum Reyes' });
    await expect
      .poll(() => callumGroup.getByRole('link', { name: `${site.reference} ${site.name}` }).count())
      .toBe(1);
    // The visit opened after booking, with the cautions for whoever is sent.
    const details = page.getByRole('complementary', { name: 'The open visit' });
    await expect
      .poll(() =>
        details.getByRole('heading', { name: 'Before you climb, drill or open a panel' }).count(),
      )
      .toBe(1);
    for (const caution of [
      'Ladders:',
      'hidden cables and pipes',
      'isolate the mains',
      'Asbestos',
      'Working alone?',
    ])
      expect(await details.innerText()).toContain(caution);

    // --- The calendar ----------------------------------------------------------------------------
    await page.getByRole('link', { name: 'Month calendar' }).click();
    await expect
      .poll(() =>
        calendarDay(page, bookedDay)
          .getByRole('link', { name: new RegExp(site.reference) })
          .count(),
      )
      .toBe(1);
    expect(await wcagViolations(page)).toEqual([]);

    // --- Move it two days on --------------------------------------------------------------------
    const moving = details.getByRole('form', { name: 'Send an engineer or move the visit' });
    await moving.getByLabel('Day', { exact: true }).fill(movedDay);
    await moving.getByRole('button', { name: 'Save the visit' }).click();
    await expect
      .poll(() => moving.getByRole('status').innerText())
      .toMatch(/^Saved: Callum Reyes, /);
    await expect
      .poll(() =>
        calendarDay(page, movedDay)
          .getByRole('link', { name: new RegExp(site.reference) })
          .count(),
      )
      .toBe(1);
    expect(await calendarDay(page, bookedDay).getByRole('link').count()).toBe(0);
    const moved = await db('service_visits').where({ id: stored.id }).first();
    expect(moved.version).toBe(2);
    expect(onUkClock(moved.scheduled_for)).toBe(`${movedDay} 09:30`);

    // --- Someone else changes it meanwhile: a readable refusal, the typing kept, then reload ------
    const { csrfToken } = (await (await page.request.get(`${apiUrl}/api/me`)).json()) as {
      csrfToken: string;
    };
    const elsewhere = await page.request.patch(`${apiUrl}/api/service/visits/${stored.id}`, {
      headers: { 'x-csrf-token': csrfToken },
      // 14:00 UK time that day, written with its offset from the stored 09:30.
      data: {
        version: 2,
        scheduledFor: new Date(moved.scheduled_for.getTime() + 4.5 * 3_600_000).toISOString(),
      },
    });
    expect(elsewhere.status()).toBe(200);
    await moving.getByLabel('Time').fill('11:15');
    await moving.getByRole('button', { name: 'Save the visit' }).click();
    const refusal = moving.getByRole('alert');
    await expect
      .poll(() => refusal.innerText())
      .toContain('The change to this visit was not saved');
    expect(await refusal.innerText()).toContain(
      'Someone else saved a change since you opened this.',
    );
    expect(await moving.getByLabel('Time').inputValue()).toBe('11:15');
    // The details above already show what is saved now.
    await expect.poll(() => details.innerText()).toContain('14:00');
    await refusal.getByRole('button', { name: 'Reload latest' }).click();
    await expect.poll(() => moving.getByLabel('Time').inputValue()).toBe('14:00');
    await moving.getByLabel('Time').fill('11:15');
    await moving.getByRole('button', { name: 'Save the visit' }).click();
    await expect.poll(() => moving.getByRole('status').innerText()).toMatch(/11:15\.$/);
    expect((await db('service_visits').where({ id: stored.id }).first()).version).toBe(4);

    // --- The overdue list --------------------------------------------------------------------------
    const overdue = page.getByRole('region', { name: 'Overdue preventive visits' });
    await expect
      .poll(() => overdue.innerText())
      .toContain(`Plan rule: ${PLAN_RULE} (${PLAN_SOURCE}).`);
    const apiOverdue = (await (await page.request.get(`${apiUrl}/api/service/overdue`)).json()) as {
      sites: { siteId: string; daysOverdue: number }[];
    };
    const lateEntry = apiOverdue.sites.find((entry) => entry.siteId === lateSite.id)!;
    expect(lateEntry.daysOverdue).toBeGreaterThan(0);
    const lateRow = overdue.getByRole('row').filter({ hasText: lateSite.reference });
    await expect.poll(() => lateRow.innerText()).toContain(`${lateEntry.daysOverdue} days overdue`);
    // Booking from the overdue list opens the form with that site chosen.
    await lateRow.getByRole('link', { name: `Book a visit for ${lateSite.name}` }).click();
    await expect
      .poll(() => booking.getByLabel('Site', { exact: true }).inputValue())
      .toBe(lateSite.id);
    // Cancelling hands focus back to the button that opens the form again.
    await booking.getByRole('button', { name: 'Cancel' }).click();
    await expect
      .poll(() => page.evaluate(() => document.activeElement?.textContent))
      .toBe('Book a visit');
    await context.close();

    // --- The engineer sent sees the visit, read-only, with the cautions ---------------------------
    const engineerContext = await browser().newContext({ viewport: DESK });
    const engineer = await engineerContext.newPage();
    await signInAs(engineer, db, 'engineer');
    await engineer.goto(`${apiUrl}/engineer/service?month=${nextMonth}`);
    await expect
      .poll(() => engineer.getByRole('heading', { level: 2, name: /^Your visits in / }).count())
      .toBe(1);
    await engineer.getByRole('link', { name: `${site.reference} ${site.name}` }).click();
    const engineerDetails = engineer.getByRole('complementary', { name: 'The open visit' });
    await expect
      .poll(() => engineerDetails.innerText())
      .toContain('Before you climb, drill or open a panel');
    expect(await engineerDetails.getByRole('button', { name: 'Save the visit' }).count()).toBe(0);
    expect(await engineer.getByRole('button', { name: 'Book a visit' }).count()).toBe(0);
    expect(await wcagViolations(engineer)).toEqual([]);
    await engineerContext.close();
  });

  it('shows the homeowner their home’s service plan with its rule and source as stated', async () => {
    const context = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await signInAs(page, db, 'homeowner');
    const home = await db('sites').where({ name: 'Marsh residence' }).first('id');
    await page.goto(`${apiUrl}/homeowner/homes/${home.id}`);
    const plan = page.getByRole('region', { name: 'Service plan for your system' });
    await expect.poll(() => plan.innerText()).toContain(PLAN_RULE);
    const text = await plan.innerText();
    expect(text).toContain(PLAN_SOURCE);
    expect(text).toContain('2 preventive visits a year');
    expect(text).toMatch(/Overdue: \d+ days? overdue|Not overdue|Due today|No due date yet/);
    expect(await wcagViolations(page)).toEqual([]);
    await context.close();
  });
});
