import { afterAll, describe, expect, inject, it } from 'vitest';
import { closeTestDb, testDb } from '../setup/database';
import { signInAs } from '../setup/browser-sign-in';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const browser = useChromium();
const db = testDb();
const PHONE = { width: 390, height: 844 };
const { apiUrl } = inject('stack');
afterAll(closeTestDb);

describe('a homeowner on a phone', () => {
  it('adds a keyholder and moves them up the call order', async () => {
    const context = await browser().newContext({ viewport: PHONE, hasTouch: true });
    const page = await context.newPage();
    await signInAs(page, db, 'homeowner');
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('My home');

    await page
      .getByRole('link', { name: /Marsh residence/ })
      .first()
      .click();
    await page.getByRole('link', { name: 'Keyholders' }).first().click();
    const callOrder = page.getByRole('list', { name: 'Call order' });
    await callOrder.waitFor();
    const before = await callOrder.getByRole('listitem').count();

    await page.getByRole('button', { name: 'Add keyholder' }).click();
    await page.getByLabel('Full name').fill('Priya Natt');
    await page.getByLabel('Mobile phone').fill('07700 900456');
    await page.getByLabel('Minutes to reach the site').fill('15');
    await page.getByRole('button', { name: 'Save keyholder' }).click();
    await expect.poll(() => callOrder.getByRole('listitem').count()).toBe(before + 1);
    await expect
      .poll(() => callOrder.getByRole('listitem').last().textContent())
      .toContain(`${before + 1}. Priya Natt`);

    await page.getByRole('button', { name: 'Move Priya Natt up' }).click();
    await expect
      .poll(() =>
        callOrder
          .getByRole('listitem')
          .nth(before - 1)
          .textContent(),
      )
      .toContain(`${before}. Priya Natt`);
    // The new order is saved, not just shown.
    await expect
      .poll(
        async () =>
          (await db('keyholders').where({ name: 'Priya Natt' }).first('call_order'))?.call_order,
      )
      .toBe(before);

    // Nothing on the page offers a field for an alarm code.
    await page.getByRole('link', { name: 'User codes' }).first().click();
    await expect
      .poll(() => page.getByText(/never asks for, stores or sends alarm codes/i).count())
      .toBeGreaterThan(0);
    expect(await page.locator('input[name*="code" i], input[name*="pin" i]').count()).toBe(0);
    await context.close();
  });
});

describe('a keyholder on a phone', () => {
  it('sees the address, access notes, hazards, their place in the call order and attend time, and nothing else', async () => {
    const context = await browser().newContext({ viewport: PHONE, hasTouch: true });
    const page = await context.newPage();
    await signInAs(page, db, 'keyholder');
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toBe('Keyholder home');

    const holdings = await db('keyholders as k')
      .join('users as u', 'u.id', 'k.user_id')
      .join('sites as s', 's.id', 'k.site_id')
      .where('u.email', 'sam.whitlock@example.com')
      .select('s.id', 's.name', 's.postcode', 's.hazards', 'k.call_order', 'k.minutes_to_attend');
    expect(holdings.length).toBeGreaterThan(0);
    const body = page.locator('main');
    for (const holding of holdings) {
      // The postcode, not the name: an open alarm card also names the site.
      await expect.poll(() => body.textContent()).toContain(holding.postcode);
      expect(await body.textContent()).toContain(holding.name);
      if (holding.hazards) expect(await body.textContent()).toContain(holding.hazards);
    }
    const text = (await body.textContent()) ?? '';
    expect(text).toMatch(/number \d+ of \d+/i);
    expect(text).toMatch(/\d+ minutes/);
    expect(text).toMatch(/forced entry/i);

    // What a keyholder must not see: zones, other keyholders, user-code holders.
    const zoneLocations = await db('zones as z')
      .join('systems as sy', 'sy.id', 'z.system_id')
      .where('sy.site_id', holdings[0]!.id)
      .pluck('z.location');
    for (const location of zoneLocations.filter((l: string) => l.length > 8))
      expect(text).not.toContain(location);
    const others = await db('keyholders')
      .where({ site_id: holdings[0]!.id })
      .whereNull('user_id')
      .pluck('name');
    for (const name of others) expect(text).not.toContain(name);
    expect(
      await page.evaluate(
        async (siteId) => (await fetch(`/api/sites/${siteId}/zones`)).status,
        holdings[0]!.id,
      ),
    ).toBe(403);
    expect(page.url().startsWith(apiUrl)).toBe(true);
    await context.close();
  });
});
