import { afterAll, describe, expect, inject, it } from 'vitest';
import { DETECTOR_KIND_LABELS, ZONE_TYPE_LABELS } from '../../server/zones/schema';
import { signInAs } from '../setup/browser-sign-in';
import { closeTestDb, testDb } from '../setup/database';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const browser = useChromium();
const db = testDb();
const { apiUrl } = inject('stack');
afterAll(closeTestDb);

const EIGHT_ZONES = [
  ['Front door', 'entry_exit', 'magnetic_contact'],
  ['Hall', 'entry_route', 'dual_technology'],
  ['Lounge', 'instant', 'dual_technology'],
  ['Kitchen', 'instant', 'pir'],
  ['Back door', 'instant', 'magnetic_contact'],
  ['Dining room', 'instant', 'pir'],
  ['Landing', 'instant', 'pir'],
  ['Garage', 'instant', 'dual_technology'],
] as const;

describe('an engineer at a desk', () => {
  it('creates a site, records its panel and fits eight zones', async () => {
    const context = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    await signInAs(page, db, 'engineer');
    await page.getByRole('link', { name: 'Sites' }).click();
    await page.waitForURL(`${apiUrl}/engineer/sites**`);
    await page.getByRole('link', { name: 'New site' }).click();

    await page.getByLabel('Site name').fill('Nyberg residence');
    await page.getByRole('radio', { name: 'Domestic' }).check();
    await page.getByLabel('Address line 1').fill('9 Linden Grove');
    await page.getByLabel('Town').fill('Eastmere');
    await page.getByLabel('Postcode').fill('em2 6wd');
    await page.getByRole('radio', { name: /^Grade 2/ }).check();
    await page.getByLabel('Environmental class').selectOption('2');
    await page.getByLabel('Hazards').fill('Loft hatch over the stairs.');
    await page.getByRole('button', { name: 'Create site' }).click();

    await page.waitForURL(/\/engineer\/sites\/[0-9a-f-]{36}/);
    const siteId = page.url().match(/sites\/([0-9a-f-]{36})/)![1]!;
    const saved = await db('sites').where({ id: siteId }).first();
    expect(saved).toMatchObject({
      name: 'Nyberg residence',
      postcode: 'EM2 6WD',
      required_grade: 2,
    });

    await page.getByRole('link', { name: /^System/ }).click();
    await page.getByLabel('Control panel').fill('Hybrid 16-zone panel (invented model W16)');
    await page.getByRole('button', { name: 'Save system' }).click();
    await expect
      .poll(async () => (await db('systems').where({ site_id: siteId }).first())?.control_panel)
      .toContain('W16');

    await page.getByRole('link', { name: /^Zones/ }).click();
    const schedule = page.getByRole('list', { name: 'Zone schedule' });
    for (const [index, [location, zoneType, detectorKind]] of EIGHT_ZONES.entries()) {
      const row = index + 1;
      await page.getByRole('button', { name: 'Add zone' }).click();
      await page.getByLabel(`Location, row ${row}`, { exact: true }).fill(location);
      await page
        .getByLabel(`Zone type, row ${row}`, { exact: true })
        .selectOption({ label: ZONE_TYPE_LABELS[zoneType] });
      await page
        .getByLabel(`Detector kind, row ${row}`, { exact: true })
        .selectOption({ label: DETECTOR_KIND_LABELS[detectorKind] });
      if (row === 1) {
        await page
          .getByLabel('Loop wiring, row 1', { exact: true })
          .selectOption({ label: 'Two-resistor loop' });
        await page.getByLabel('Tamper resistor (Ω), row 1', { exact: true }).fill('2k2');
        await page.getByLabel('Alarm resistor (Ω), row 1', { exact: true }).fill('4700');
      }
    }
    await expect.poll(() => schedule.getByRole('listitem').count()).toBe(8);
    // The expected readings for a 2k2 / 4k7 loop: 2.2 kΩ secure, 6.9 kΩ in alarm.
    await expect
      .poll(() => schedule.getByRole('listitem').first().textContent())
      .toMatch(/2\.2\s?kΩ[\s\S]*6\.9\s?kΩ/);

    await page.getByRole('button', { name: 'Save schedule' }).click();
    await expect
      .poll(async () => {
        const zones = await db('zones as z')
          .join('systems as s', 's.id', 'z.system_id')
          .where('s.site_id', siteId)
          .orderBy('z.position')
          .select('z.number', 'z.location', 'z.tamper_ohms', 'z.alarm_ohms');
        return zones;
      })
      .toEqual(
        EIGHT_ZONES.map(([location], index) => ({
          number: index + 1,
          location,
          tamper_ohms: 2200,
          alarm_ohms: 4700,
        })),
      );
    await expect
      .poll(() => page.getByRole('link', { name: /^Zones/ }).textContent())
      .toContain('8');

    // Safety cautions are on the page where ladders and drills come out.
    const text = (await page.locator('main').textContent()) ?? '';
    expect(text).toMatch(/three points of contact/i);
    expect(text).toMatch(/hidden cables and pipes/i);
    await context.close();
  });

  it('shows a duplicate zone number beside the field and saves nothing', async () => {
    const context = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    await signInAs(page, db, 'engineer');
    // The demo's own Marsh residence, with its eight seeded zones.
    const site = await db('sites').where({ name: 'Marsh residence' }).first();
    await page.goto(`${apiUrl}/engineer/sites/${site.id}/zones`);
    const before = await db('zones as z')
      .join('systems as s', 's.id', 'z.system_id')
      .where('s.site_id', site.id)
      .count('* as n');
    await page.getByLabel('Zone number, row 2', { exact: true }).fill('1');
    await page.getByRole('button', { name: 'Save schedule' }).click();
    await expect
      .poll(() => page.getByText(/Zone 1 is already used in row 1/).count())
      .toBeGreaterThan(0);
    expect(
      await db('zones as z')
        .join('systems as s', 's.id', 'z.system_id')
        .where('s.site_id', site.id)
        .count('* as n'),
    ).toEqual(before);
    await context.close();
  });
});
