import { afterAll, describe, expect, inject, it } from 'vitest';
import { siteEngineering } from '../../server/engineering/site-engineering';
import { signInAs } from '../setup/browser-sign-in';
import { closeTestDb, testDb } from '../setup/database';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const browser = useChromium();
const db = testDb();
const PHONE = { width: 390, height: 844 };
const { apiUrl } = inject('stack');
afterAll(closeTestDb);

/** What a meter would show for a band's nominal value: ohms to two places, or OL when open. */
const meterReading = (ohms: number) =>
  Number.isFinite(ohms) ? String(Math.round(ohms * 100) / 100) : 'OL';

describe('an engineer commissioning on a phone', () => {
  it("walk-tests the demo site's zones, tests the system, and the pre-issue check turns clear", async () => {
    const site = await db('sites').where({ name: 'Marsh residence' }).first();
    // The expected readings come from the site's own recorded loops (resistor pairs, cable runs).
    const engineering = await siteEngineering(db, site.id);
    expect(engineering).not.toBeNull();
    const zones = [...engineering!.zones].sort((a, b) => a.number - b.number);
    expect(zones.length).toBeGreaterThanOrEqual(8);
    // Start from a freshly fitted system: another browser test may have commissioned this site.
    const system = await db('systems').where({ site_id: site.id }).first('id');
    await db('walk_tests')
      .whereIn(
        'zone_id',
        zones.map((zone) => zone.zoneId),
      )
      .delete();
    await db('system_tests').where({ system_id: system.id }).delete();

    const context = await browser().newContext({ viewport: PHONE, hasTouch: true });
    const page = await context.newPage();
    await signInAs(page, db, 'engineer');
    await page.goto(`${apiUrl}/engineer/sites/${site.id}`);
    await page.getByRole('link', { name: 'Commissioning' }).first().click();
    await page.waitForURL(`${apiUrl}/engineer/sites/${site.id}/commissioning**`);

    await page.getByRole('heading', { name: 'Walk tests' }).waitFor();
    // The cautions come first on the commissioning screen.
    const cautions = await page.locator('main').textContent();
    expect(cautions).toMatch(/ladder|height/i);
    expect(cautions).toMatch(/hidden cables and pipes/i);
    expect(cautions).toMatch(/isolate the mains|mains/i);

    const check = page.getByRole('region', { name: 'Pre-issue check' });
    await expect.poll(() => check.textContent()).toContain('Cannot be issued yet');

    // Nothing sideways: the page fits a 390-pixel phone without scrolling across.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
      PHONE.width,
    );

    await page.getByRole('button', { name: `Walk-test zone ${zones[0]!.number}` }).click();
    for (const [index, zone] of zones.entries()) {
      const normal = zone.bands.find((band) => band.state === 'normal')!;
      const alarm = zone.bands.find((band) => band.state === 'alarm');
      await page
        .getByLabel('Secure reading (Ω)', { exact: true })
        .fill(meterReading(normal.nominalOhms));
      await page
        .getByLabel(/^Alarm reading \(Ω\)/)
        .fill(alarm ? meterReading(alarm.nominalOhms) : 'OL');
      await page.getByLabel('The panel showed the zone when I walked it').check();
      await page.getByRole('button', { name: 'Save walk test' }).click();
      await expect
        .poll(() => page.getByRole('status').filter({ hasText: 'walk test' }).first().textContent())
        .toContain(`Zone ${zone.number} passed its walk test`);
      if (index < zones.length - 1) await page.getByRole('button', { name: 'Next zone' }).click();
    }
    // Every zone's test is in the database, computed as passed by the API.
    const stored = await db('walk_tests as w')
      .join('zones as z', 'z.id', 'w.zone_id')
      .whereIn(
        'z.id',
        zones.map((zone) => zone.zoneId),
      )
      .where('w.passed', true)
      .countDistinct('z.id as n');
    expect(Number(stored[0]!.n)).toBe(zones.length);

    await page.getByLabel('Internal sounder sounded').check();
    await page.getByLabel('External sounder sounded').check();
    await page.getByLabel('Strobe flashed').check();
    await page.getByRole('button', { name: 'Save sounder test' }).click();

    await page.getByLabel('Received by the monitoring centre').check();
    await page.getByLabel('Centre’s reference').fill('T-4412');
    await page.getByRole('button', { name: 'Save signalling test' }).click();

    await page.getByLabel('Resting voltage (V)').fill('13.2');
    await page.getByLabel('Voltage under load (V)').fill('12.6');
    await page.getByLabel('Load current (A)').fill('1.5');
    await page.getByLabel('Load time (minutes)').fill('10');
    await page.getByRole('button', { name: 'Save battery test' }).click();

    await expect.poll(() => check.textContent(), { timeout: 15_000 }).toContain('Ready to issue');
    const kinds = await db('system_tests as t')
      .join('systems as s', 's.id', 't.system_id')
      .where({ 's.site_id': site.id, 't.passed': true })
      .distinct('t.kind')
      .pluck('t.kind');
    expect(kinds.sort()).toEqual(['battery', 'signalling', 'sounders']);
    await context.close();
  });

  it('refuses a reading in the wrong units beside the field and saves nothing', async () => {
    const site = await db('sites').where({ name: 'Marsh residence' }).first();
    const countTests = async () =>
      Number(
        (
          await db('walk_tests as w')
            .join('zones as z', 'z.id', 'w.zone_id')
            .join('systems as s', 's.id', 'z.system_id')
            .where('s.site_id', site.id)
            .count('* as n')
        )[0]!.n,
      );
    const before = await countTests();
    const context = await browser().newContext({ viewport: PHONE, hasTouch: true });
    const page = await context.newPage();
    await signInAs(page, db, 'engineer');
    await page.goto(`${apiUrl}/engineer/sites/${site.id}/commissioning`);
    await page
      .getByRole('button', { name: /^Walk-test zone/ })
      .first()
      .click();
    await page.getByLabel('Secure reading (Ω)', { exact: true }).fill('2.2');
    await page.getByRole('button', { name: 'Save walk test' }).click();
    const field = page.getByLabel('Secure reading (Ω)', { exact: true });
    await expect.poll(() => field.getAttribute('aria-invalid')).toBe('true');
    // "2.2" on a kilohm loop is read as ambiguous, not silently as 2.2 Ω.
    expect(await page.getByText(/ambiguous/i).count()).toBeGreaterThan(0);
    expect(await countTests()).toBe(before);
    await context.close();
  });
});
