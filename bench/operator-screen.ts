import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Page } from 'playwright-core';
import { build } from 'vite';
import { totpCode } from '../idp/totp';
import { loadConfig } from '../server/config/config';
import { createDb } from '../server/db/knex';
import { repoRoot } from '../server/paths';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../seeds/data/demo-scenario';
import { launchChromium } from '../tests/setup/chromium';
import { startStack } from '../tests/setup/stack';
import { createTestDatabase } from '../tests/setup/test-database';
import { startTestReceiver } from '../tests/setup/test-receiver';
import { median, percentile } from './lib/load';

/**
 * Signal to the operator's screen, in a real browser: from sending a DC-09 frame to the
 * receiver until the new row is drawn in the operator's queue, with nothing reloaded. It covers
 * the receiver's commit and ACK, PostgreSQL NOTIFY, the server-sent event, the client's
 * coalescing pause (50 ms), the queue's refetch and React's render. Prints figures, never
 * passes or fails on them. `npx tsx bench/operator-screen.ts`.
 */
const ALARMS = Number(process.env.BENCH_SCREEN_ALARMS ?? 30);

async function signInAsOperator(page: Page, apiUrl: string) {
  const operator = DEMO_ACCOUNTS.find((account) => account.role === 'operator')!;
  await page.goto(`${apiUrl}/auth/login`);
  await page.getByLabel('E-mail address').fill(operator.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByLabel('One-time code').fill(totpCode(operator.totpSecret!));
  await page.getByRole('button', { name: 'Continue' }).click();
  await page.getByText('Live', { exact: true }).waitFor();
}

/** Takes and closes the event through the API, so the next alarm opens a new one. */
async function clearEvent(page: Page, eventId: string) {
  // No named helpers inside: tsx would wrap them in a function the page does not have.
  await page.evaluate(async (id) => {
    const { csrfToken } = (await (await fetch('/api/me')).json()) as { csrfToken: string };
    const headers = { 'Content-Type': 'application/json', 'x-csrf-token': csrfToken };
    const url = `/api/monitoring/events/${id}`;
    await fetch(`${url}/take`, { method: 'POST', headers, body: '{}' });
    await fetch(`${url}/close`, {
      method: 'POST',
      headers,
      body: JSON.stringify({ outcome: 'test_or_engineer', note: 'Benchmark' }),
    });
  }, eventId);
}

export async function benchOperatorScreen() {
  const clientDir = path.join(loadConfig(process.env).dataDir, 'bench-client');
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  await build({
    root: repoRoot,
    configFile: path.join(repoRoot, 'vite.config.ts'),
    logLevel: 'warn',
    build: { outDir: clientDir, emptyOutDir: true },
  });
  process.env.NODE_ENV = nodeEnv;

  const { connection, drop } = await createTestDatabase();
  const stack = await startStack({ database: connection, clientDir, sendTexts: false });
  const db = createDb(connection, 4);
  const receiver = await startTestReceiver(db);
  const browser = await launchChromium();
  try {
    const page = await (
      await browser.newContext({ viewport: { width: 1600, height: 900 } })
    ).newPage();
    await signInAsOperator(page, stack.apiUrl);
    const site = await db('sites').where({ name: 'Marsh residence' }).first('monitoring_account');
    const timings: number[] = [];
    for (let alarm = 0; alarm < ALARMS; alarm += 1) {
      const started = performance.now();
      const eventId = await receiver.send({
        format: 'adm-cid',
        account: site.monitoring_account,
        code: '130',
        zone: 1 + (alarm % 8),
        partition: 1,
        qualifier: 'new',
        sequence: 8000 + alarm,
      });
      await page.locator(`tr[data-event-id="${eventId}"]`).waitFor();
      timings.push(performance.now() - started);
      await clearEvent(page, eventId!);
      await page.locator(`tr[data-event-id="${eventId}"]`).waitFor({ state: 'detached' });
    }
    const sorted = [...timings].sort((a, b) => a - b);
    console.log(`Signal to operator's screen (Chromium), ${ALARMS} alarms one at a time:`);
    console.log(
      `  median ${median(timings).toFixed(0)} ms, p90 ${percentile(sorted, 0.9).toFixed(0)} ms, max ${sorted.at(-1)!.toFixed(0)} ms`,
    );
  } finally {
    await browser.close();
    await receiver.stop();
    await db.destroy();
    await stack.stop();
    await drop();
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await benchOperatorScreen();
