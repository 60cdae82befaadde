import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { wcagViolations } from '../setup/axe';
import { signInAs } from '../setup/browser-sign-in';
import { closeTestDb, testDb } from '../setup/database';
import { startTestReceiver, type TestReceiver } from '../setup/test-receiver';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const browser = useChromium();
const db = testDb();
const { apiUrl } = inject('stack');
const PHONE = { width: 390, height: 844 };
const DESK = { width: 1366, height: 900 };
let receiver: TestReceiver;
let operatorContext: BrowserContext | undefined;
let operatorPage: Promise<Page> | undefined;

beforeAll(async () => {
  receiver = await startTestReceiver(db);
});
afterAll(async () => {
  await operatorContext?.close();
  await receiver.stop();
  await closeTestDb();
});

// The operator's side is set up through the API as the signed-in demo operator, the way their
// screen does it; what these tests look at is the keyholder's, homeowner's and office's screens.
// Signing in (with a one-time code) happens once, inside the first test that needs it.
function signedInOperator(): Promise<Page> {
  operatorPage ??= (async () => {
    operatorContext = await browser().newContext({ viewport: DESK });
    const page = await operatorContext.newPage();
    await signInAs(page, db, 'operator');
    return page;
  })();
  return operatorPage;
}

async function asOperator(path: string, body: unknown = {}) {
  const page = await signedInOperator();
  return page.evaluate(
    async ({ path, body }) => {
      const me = (await (await fetch('/api/me')).json()) as { csrfToken: string };
      const response = await fetch(path, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', 'x-csrf-token': me.csrfToken },
        body: JSON.stringify(body),
      });
      return { status: response.status, body: (await response.json()) as unknown };
    },
    { path, body },
  );
}

async function siteNamed(name: string) {
  return db('sites').where({ name }).first('id', 'monitoring_account');
}

/** Nothing wider than the phone's screen: no sideways scrolling at 390 px. */
const fitsThePhone = (page: Page) =>
  page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);

describe('a keyholder asked to attend', () => {
  it('sees the alarm at the top of their home, with the cautions, and answers “on my way”', async () => {
    const site = await siteNamed('Eastmere Pharmacy');
    const eventId = await receiver.send({
      format: 'adm-cid',
      account: site.monitoring_account,
      code: '130',
      zone: 2,
      partition: 1,
      qualifier: 'new',
      sequence: 6201,
    });
    expect((await asOperator(`/api/monitoring/events/${eventId}/take`)).status).toBe(200);
    expect((await asOperator(`/api/monitoring/events/${eventId}/call-out`)).status).toBe(200);

    const context = await browser().newContext({ viewport: PHONE, hasTouch: true });
    const page = await context.newPage();
    await signInAs(page, db, 'keyholder');
    const alert = page.getByRole('article', { name: 'Intruder alarm at Eastmere Pharmacy' });
    await expect.poll(() => alert.count()).toBe(1);
    const card = await alert.innerText();
    expect(card).toMatch(/Do not go in if there are signs of forced entry/);
    expect(card).toMatch(/Do not go alone/);
    expect(card).toMatch(/Keep your phone on/);
    // The alert comes before everything else on the page.
    const firstArticle = page.locator('main article').first();
    expect(await firstArticle.getAttribute('aria-labelledby')).toBe(
      await alert.getAttribute('aria-labelledby'),
    );

    const onMyWay = alert.getByRole('button', { name: /on my way/ });
    await onMyWay.click();
    await expect.poll(() => alert.innerText()).toMatch(/You told the centre you are on your way/);
    expect(await onMyWay.getAttribute('aria-pressed')).toBe('true');
    expect(await wcagViolations(page)).toEqual([]);
    const message = await db('keyholder_messages as m')
      .join('keyholders as k', 'k.id', 'm.keyholder_id')
      .join('users as u', 'u.id', 'k.user_id')
      .where({ 'm.event_id': eventId, 'u.email': 'sam.whitlock@example.com' })
      .first('m.reply');
    expect(message.reply).toBe('attending');
    expect(await fitsThePhone(page)).toBe(true);
    await context.close();
    // Closed again, so no other test finds the demo keyholder with an alarm on their page.
    const closed = await asOperator(`/api/monitoring/events/${eventId}/close`, {
      outcome: 'test_or_engineer',
      note: 'Browser test of the keyholder alert.',
    });
    expect(closed.status).toBe(200);
  }, 120_000);
});

describe('a homeowner reading their signal history', () => {
  it('pages back through their own home’s signals, and is refused another home’s', async () => {
    const home = await siteNamed('Marsh residence');
    // A set by user 2 (Contact ID 401, restore) and a run of periodic tests (602), none of which
    // opens an event; more than one page of them.
    await receiver.send({
      format: 'adm-cid',
      account: home.monitoring_account,
      code: '401',
      zone: 2,
      partition: 1,
      qualifier: 'restore',
      sequence: 6300,
    });
    for (let sequence = 6301; sequence <= 6355; sequence += 1) {
      await receiver.send({
        format: 'adm-cid',
        account: home.monitoring_account,
        code: '602',
        zone: 0,
        partition: 1,
        qualifier: 'new',
        sequence,
      });
    }

    const context = await browser().newContext({ viewport: PHONE, hasTouch: true });
    const page = await context.newPage();
    await signInAs(page, db, 'homeowner');
    await page
      .getByRole('link', { name: /Marsh residence/ })
      .first()
      .click();
    await page.getByRole('link', { name: 'Signal history' }).click();
    await expect
      .poll(() => page.getByRole('heading', { level: 2, name: 'Signal history' }).count())
      .toBe(1);
    const signals = page.getByRole('list', { name: 'Signals, newest first' });
    await expect.poll(() => signals.getByRole('listitem').count()).toBe(50);
    expect(await signals.innerText()).toContain('Periodic test');
    expect(await page.locator('main').innerText()).toMatch(
      /\d+ false alarms? in the last 12 months/,
    );
    expect(await fitsThePhone(page)).toBe(true);
    expect(await wcagViolations(page)).toEqual([]);

    await page.getByRole('button', { name: 'Show older' }).click();
    await expect.poll(() => signals.getByRole('listitem').count()).toBeGreaterThan(50);
    await expect.poll(() => signals.innerText()).toContain('Set by user 2');
    // Focus moves to the first of the older signals, so the reader keeps their place.
    expect(await page.evaluate(() => document.activeElement?.closest('li')?.id ?? null)).toBe(
      await signals.getByRole('listitem').nth(50).getAttribute('id'),
    );

    const notTheirs = await db('sites as s')
      .whereNotExists(
        db('site_homeowners as h')
          .join('users as u', 'u.id', 'h.user_id')
          .whereRaw('h.site_id = s.id')
          .where('u.email', 'helen.marsh@example.com'),
      )
      .first('s.id', 's.name');
    expect(
      await page.evaluate(
        async (siteId) => (await fetch(`/api/my/homes/${siteId}/signals`)).status,
        notTheirs.id,
      ),
    ).toBe(404);
    await page.goto(`${apiUrl}/homeowner/homes/${notTheirs.id}/signals`);
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toBe('Page not found');
    expect(await page.locator('main').innerText()).not.toContain(notTheirs.name);
    await context.close();
  });
});

describe('the office looking after a monitored site', () => {
  it('sees its false alarms over the last 12 months, with the police-response standing', async () => {
    const site = await siteNamed('Osei residence');
    const eventId = await receiver.send({
      format: 'adm-cid',
      account: site.monitoring_account,
      code: '130',
      zone: 1,
      partition: 1,
      qualifier: 'new',
      sequence: 6401,
    });
    expect((await asOperator(`/api/monitoring/events/${eventId}/take`)).status).toBe(200);
    const closed = await asOperator(`/api/monitoring/events/${eventId}/close`, {
      outcome: 'false_alarm_equipment',
      note: 'Detector in the kitchen faulty; installer told.',
    });
    expect(closed.status).toBe(200);
    // Enough earlier false alarms that police response is due to be withdrawn (NPCC: three in
    // 12 months), so the card also says what brings it back.
    const earlier = await db('alarm_events')
      .where({ site_id: site.id, status: 'closed' })
      .whereLike('outcome', 'false_alarm%')
      .where('first_signal_at', '>', db.raw("now() - interval '12 months'"))
      .count<{ count: string }[]>('id as count');
    for (let extra = Number(earlier[0]!.count); extra < 3; extra += 1) {
      await db('alarm_events').insert({
        site_id: site.id,
        account: site.monitoring_account,
        category: 'burglary',
        priority: 3,
        status: 'closed',
        outcome: 'false_alarm_user',
        first_signal_at: db.raw(`now() - make_interval(days => ?)`, [20 + extra]),
        last_signal_at: db.raw(`now() - make_interval(days => ?)`, [20 + extra]),
        closed_at: db.raw(`now() - make_interval(days => ?)`, [20 + extra]),
      });
    }
    const counted = await db('alarm_events')
      .where({ site_id: site.id, status: 'closed' })
      .whereLike('outcome', 'false_alarm%')
      .where('first_signal_at', '>', db.raw("now() - interval '12 months'"))
      .count<{ count: string }[]>('id as count');
    const expected = Number(counted[0]!.count);

    const context = await browser().newContext({ viewport: DESK });
    const page = await context.newPage();
    await signInAs(page, db, 'office');
    await page.goto(`${apiUrl}/office/sites/${site.id}`);
    const card = page.getByRole('region', { name: 'False alarms, last 12 months' });
    await expect
      .poll(() => card.innerText())
      .toContain(`${expected} false ${expected === 1 ? 'alarm' : 'alarms'} in the last 12 months`);
    expect(await card.innerText()).toContain('False alarm: equipment fault');
    const reinstating = card.getByRole('region', { name: 'Reinstating police response' });
    expect(await reinstating.innerText()).toContain('Reinstating police response: not yet');
    expect(await reinstating.innerText()).toContain('3 months free of false alarms');
    expect(await wcagViolations(page)).toEqual([]);
    await context.close();
  }, 120_000);
});
