import { afterAll, describe, expect, inject, it } from 'vitest';
import { signInAs } from '../setup/browser-sign-in';
import { closeTestDb, testDb } from '../setup/database';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const browser = useChromium();
const db = testDb();
const { apiUrl } = inject('stack');
afterAll(closeTestDb);

describe('an engineer at the calculators', () => {
  it('checks a 2k2 / 4k7 loop reading and looks up a resistor’s colour bands', async () => {
    const context = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    await signInAs(page, db, 'engineer');
    await page.getByRole('link', { name: 'Calculators' }).first().click();
    await page.waitForURL(`${apiUrl}/engineer/calculators**`);

    // Two-resistor loop, 2.2 kΩ tamper and 4.7 kΩ alarm: 2.2 kΩ secure, 6.9 kΩ in alarm
    // (../shared/checks.md, the worked example the product started from).
    await page.getByLabel('Loop wiring').selectOption({ label: 'Two-resistor loop' });
    await page.getByLabel(/^Tamper resistor/).fill('2K2');
    await page.getByLabel(/^Alarm resistor/).fill('4K7');
    await page.getByLabel(/^Reading to check/).fill('6k9');
    await page.getByRole('button', { name: 'Check loop' }).click();
    const main = page.locator('main');
    await expect.poll(() => main.textContent()).toMatch(/6\.9 kΩ/);
    expect(await main.textContent()).toMatch(/2\.2 kΩ/);

    // IEC 60062: 4.7 kΩ at ±5 % is yellow, violet, red, gold.
    await page.getByRole('textbox', { name: 'Resistor value' }).fill('4k7');
    await page.getByRole('button', { name: 'Look up resistor' }).click();
    await expect
      .poll(async () => (await main.textContent())?.toLowerCase())
      .toMatch(/yellow.*violet.*red.*gold/);
    await context.close();
  });
});
