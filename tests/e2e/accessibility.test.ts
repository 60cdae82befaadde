import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { describe, expect, inject, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../seeds/data/demo-scenario';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

// axe-core's rules for WCAG 2.0, 2.1 and 2.2 at levels A and AA (Deque's axe-core rule tags).
const WCAG_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
const { apiUrl, idpUrl } = inject('stack');
const browser = useChromium();

/** axe needs a page of its own context. */
async function newPage(viewport: { width: number; height: number }) {
  const context = await browser().newContext({ viewport });
  return context.newPage();
}

async function violations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(WCAG_AA).analyze();
  return results.violations.map(
    (v) => `${v.id}: ${v.help} (${v.nodes.length}×, e.g. ${v.nodes[0]?.target})`,
  );
}

describe('WCAG 2.2 AA checks (axe-core)', () => {
  it('finds nothing on the landing page, at desk and phone widths', async () => {
    for (const viewport of [
      { width: 1366, height: 900 },
      { width: 390, height: 844 },
    ]) {
      const page = await newPage(viewport);
      await page.goto(`${apiUrl}/`);
      await page.getByRole('link', { name: 'Sign in' }).first().waitFor();
      expect(await violations(page)).toEqual([]);
      await page.context().close();
    }
  });

  it('finds nothing on the sign-in, one-time code and password-reset pages', async () => {
    const page = await newPage({ width: 390, height: 844 });
    await page.goto(`${apiUrl}/auth/login`);
    await page.waitForURL(`${idpUrl}/interaction/**`);
    expect(await violations(page)).toEqual([]);

    const operator = DEMO_ACCOUNTS.find((a) => a.role === 'operator')!;
    await page.getByLabel('E-mail address').fill(operator.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByLabel('One-time code').waitFor();
    expect(await violations(page)).toEqual([]);

    await page.goto(`${idpUrl}/password/forgot`);
    expect(await violations(page)).toEqual([]);
    await page.context().close();
  });

  it('finds nothing on a signed-in home page', async () => {
    const page = await newPage({ width: 390, height: 844 });
    const homeowner = DEMO_ACCOUNTS.find((a) => a.role === 'homeowner')!;
    await page.goto(`${apiUrl}/auth/login?returnTo=/homeowner`);
    await page.getByLabel('E-mail address').fill(homeowner.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${apiUrl}/homeowner**`);
    await page.getByRole('heading', { level: 1, name: 'My home' }).waitFor();
    expect(await violations(page)).toEqual([]);

    await page.goto(`${apiUrl}/no-such-page`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toMatch(/not found/i);
    expect(await violations(page)).toEqual([]);
    await page.context().close();
  });

  it('finds nothing on the public pack check, nor for an unknown pack number', async () => {
    const page = await newPage({ width: 390, height: 844 });
    await page.goto(`${apiUrl}/verify`);
    await page.getByRole('heading', { level: 1, name: 'Check a handover pack' }).waitFor();
    expect(await violations(page)).toEqual([]);
    await page.getByRole('textbox', { name: 'Pack number' }).fill('ZZ-999999-R1');
    await page.getByRole('button', { name: 'Check this pack' }).click();
    await page.getByRole('heading', { level: 1, name: 'No pack with that number' }).waitFor();
    expect(await violations(page)).toEqual([]);
    await page.context().close();
  });
});
