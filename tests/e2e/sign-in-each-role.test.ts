import type { Page } from 'playwright-core';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { ROLES, type Role } from '../../server/users/roles';
import { signInAs } from '../setup/browser-sign-in';
import { closeTestDb, testDb } from '../setup/database';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const { apiUrl, idpUrl } = inject('stack');
const browser = useChromium();
const db = testDb();
afterAll(closeTestDb);

const HOME_HEADINGS: Record<Role, string> = {
  engineer: 'Engineer home',
  office: 'Office home',
  operator: 'Operator home',
  homeowner: 'My home',
  keyholder: 'Keyholder home',
};

// Staff work at desks; homeowners and keyholders mostly on phones.
const VIEWPORTS: Record<Role, { width: number; height: number }> = {
  engineer: { width: 1366, height: 900 },
  office: { width: 1366, height: 900 },
  operator: { width: 1600, height: 900 },
  homeowner: { width: 390, height: 844 },
  keyholder: { width: 390, height: 844 },
};

const signInThroughLoginPage = async (page: Page, role: Role) => {
  await signInAs(page, db, role, { fromLandingPage: true });
  await page.waitForURL(`${apiUrl}/${role}**`);
};

describe('signing in through the real login page', () => {
  it.each(ROLES)(
    'takes the demo %s to their home, and the API refuses them the other roles',
    async (role) => {
      const context = await browser().newContext({ viewport: VIEWPORTS[role] });
      const page = await context.newPage();
      const consoleErrors: string[] = [];
      page.on('console', (message) => {
        if (message.type() === 'error') consoleErrors.push(message.text());
      });

      await signInThroughLoginPage(page, role);
      await expect
        .poll(() => page.getByRole('heading', { level: 1 }).textContent(), { timeout: 10_000 })
        .toBe(HOME_HEADINGS[role]);
      await expect
        .poll(() => page.getByRole('button', { name: 'Sign out' }).isVisible())
        .toBe(true);
      // The only expected console error is the 401 from /api/me while still signed out.
      expect(consoleErrors.filter((text) => !text.includes('401'))).toEqual([]);

      const statuses = await page.evaluate(
        async (roles) => {
          const answers: Record<string, number> = {};
          for (const other of roles) answers[other] = (await fetch(`/api/homes/${other}`)).status;
          return answers;
        },
        ROLES as unknown as string[],
      );
      for (const other of ROLES) {
        expect(statuses[other], `${role} asking for the ${other} home`).toBe(
          other === role ? 200 : 403,
        );
      }
      await context.close();
    },
  );
});

describe('signing out', () => {
  it('ends both sessions and returns to the landing page', async () => {
    const context = await browser().newContext({ viewport: VIEWPORTS.keyholder });
    const page = await context.newPage();
    await signInThroughLoginPage(page, 'keyholder');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(`${apiUrl}/`);
    await expect
      .poll(() => page.getByRole('link', { name: 'Sign in' }).first().isVisible())
      .toBe(true);
    expect(await page.evaluate(async () => (await fetch('/api/me')).status)).toBe(401);

    // The IdP session has ended too: signing in asks for the password again.
    await page.getByRole('link', { name: 'Sign in' }).first().click();
    await page.waitForURL(`${idpUrl}/interaction/**`);
    await expect.poll(() => page.getByLabel('Password').isVisible()).toBe(true);
    await context.close();
  });

  it('shows a readable page when the sign-in callback is tampered with', async () => {
    const context = await browser().newContext();
    const page = await context.newPage();
    await page.goto(`${apiUrl}/auth/callback?code=forged&state=forged`);
    await page.waitForURL(`${apiUrl}/signin-error**`);
    await expect
      .poll(() => page.getByRole('link', { name: 'Try signing in again' }).isVisible())
      .toBe(true);
    await context.close();
  });
});
