import type { Knex } from 'knex';
import type { Page } from 'playwright-core';
import { expect, inject } from 'vitest';
import { totpCode } from '../../idp/totp';
import type { Role } from '../../server/users/roles';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../seeds/data/demo-scenario';
import './provided';

const STEP_MS = 30_000;

/**
 * A one-time code the IdP will accept now. Each 30-second step works once per account, so
 * when an earlier test used this step, take the next one (one step of drift is allowed) or,
 * failing that, wait for it.
 */
export async function unusedTotpCode(db: Knex, email: string, secret: string): Promise<string> {
  for (;;) {
    const account = await db('idp.accounts')
      .whereRaw('lower(email) = lower(?)', [email])
      .first('totp_last_step');
    const lastUsed =
      account?.totp_last_step === null || account?.totp_last_step === undefined
        ? -1
        : Number(account.totp_last_step);
    const now = Math.floor(Date.now() / STEP_MS);
    for (const step of [now, now + 1]) {
      if (step > lastUsed) return totpCode(secret, step * STEP_MS + 1000);
    }
    await new Promise((resolve) => setTimeout(resolve, (now + 1) * STEP_MS - Date.now() + 200));
  }
}

/**
 * Signs a demo account in through the real login page (and its one-time code, for staff),
 * starting from the landing page's "Sign in" link or straight from /auth/login.
 */
export async function signInAs(
  page: Page,
  db: Knex,
  role: Role,
  options: { fromLandingPage?: boolean; returnTo?: string } = {},
) {
  const { apiUrl, idpUrl } = inject('stack');
  const account = DEMO_ACCOUNTS.find((candidate) => candidate.role === role)!;
  if (options.fromLandingPage) {
    await page.goto(`${apiUrl}/`);
    await page.getByRole('link', { name: 'Sign in' }).first().click();
  } else {
    const returnTo = options.returnTo ? `?returnTo=${encodeURIComponent(options.returnTo)}` : '';
    await page.goto(`${apiUrl}/auth/login${returnTo}`);
  }
  await page.waitForURL(`${idpUrl}/interaction/**`);
  await expect
    .poll(() => page.getByRole('heading', { level: 1 }).textContent())
    .toBe('Sign in to Wardbook');
  await page.getByLabel('E-mail address').fill(account.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  if (account.totpSecret) {
    await page
      .getByLabel('One-time code')
      .fill(await unusedTotpCode(db, account.email, account.totpSecret));
    await page.getByRole('button', { name: 'Continue' }).click();
  }
  await page.waitForURL(
    (url) => url.origin === new URL(apiUrl).origin && !url.pathname.startsWith('/auth/'),
  );
  await expect.poll(() => page.getByRole('heading', { level: 1 }).count()).toBeGreaterThan(0);
}
