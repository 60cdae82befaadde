import { createHash, randomUUID } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import type { Locator, Page } from 'playwright-core';
import { afterAll, describe, expect, inject, it } from 'vitest';
import type { CapturedMail } from '../../server/fakes/smtp/mailbox';
import { siteEngineering } from '../../server/engineering/site-engineering';
import { signInAs } from '../setup/browser-sign-in';
import { closeTestDb, testDb } from '../setup/database';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const browser = useChromium();
const db = testDb();
const PHONE = { width: 390, height: 844 };
const { apiUrl, mailUrl } = inject('stack');
afterAll(closeTestDb);

/** Draws a signature-like stroke across a signature_pad canvas with the pointer. */
async function drawSignature(page: Page, canvas: Locator) {
  await canvas.scrollIntoViewIfNeeded();
  const box = (await canvas.boundingBox())!;
  const y = box.y + box.height * 0.55;
  await page.mouse.move(box.x + box.width * 0.15, y);
  await page.mouse.down();
  for (let step = 1; step <= 24; step += 1) {
    const x = box.x + box.width * (0.15 + (0.7 * step) / 24);
    await page.mouse.move(x, y - Math.sin(step / 3) * box.height * 0.2, { steps: 2 });
  }
  await page.mouse.up();
}

/** Records the demo site's walk and system tests through the API as the engineer would. */
async function commissionThroughApi(page: Page, siteId: string) {
  const me = await (await page.request.get(`${apiUrl}/api/me`)).json();
  const headers = { 'x-csrf-token': me.csrfToken as string };
  const engineering = (await siteEngineering(db, siteId))!;
  for (const zone of engineering.zones) {
    const normal = zone.bands.find((band) => band.state === 'normal')!;
    const alarm = zone.bands.find((band) => band.state === 'alarm');
    const reading = (ohms: number) => String(Math.round(ohms * 100) / 100);
    const response = await page.request.post(`${apiUrl}/api/sites/${siteId}/walk-tests`, {
      headers,
      data: {
        clientKey: randomUUID(),
        zoneId: zone.zoneId,
        secureReading: reading(normal.nominalOhms),
        alarmReading: alarm ? reading(alarm.nominalOhms) : 'OL',
        activated: true,
      },
    });
    expect((await response.json()).passed, `zone ${zone.number}`).toBe(true);
  }
  for (const data of [
    { kind: 'sounders', internalSounded: true, externalSounded: true, strobeFlashed: true },
    { kind: 'signalling', pathPosition: 1, receivedByCentre: true, centreReference: 'T-0551' },
    { kind: 'battery', restingVolts: 13.2, loadVolts: 12.6, loadAmps: 1.5, loadMinutes: 10 },
  ]) {
    await page.request.post(`${apiUrl}/api/sites/${siteId}/system-tests`, {
      headers,
      data: { clientKey: randomUUID(), ...data },
    });
  }
}

describe('handing over the demo home', () => {
  it('the engineer signs, the homeowner countersigns by e-mail, the pack is issued, downloaded and verified', async () => {
    const site = await db('sites').where({ name: 'Marsh residence' }).first();

    // --- The engineer, at a desk after commissioning -----------------------------------------
    const desk = await browser().newContext({
      viewport: { width: 1366, height: 900 },
      acceptDownloads: true,
    });
    const engineer = await desk.newPage();
    await signInAs(engineer, db, 'engineer');
    await commissionThroughApi(engineer, site.id);
    await engineer.goto(`${apiUrl}/engineer/sites/${site.id}`);
    await engineer.getByRole('link', { name: 'Handover' }).first().click();
    await engineer.waitForURL(`${apiUrl}/engineer/sites/${site.id}/handover**`);
    await engineer.getByRole('heading', { name: 'Signatures' }).waitFor();
    // Anything still blocking is written down for the customer to accept.
    const writeDown = engineer.getByRole('button', { name: /^Write down as a variation:/ });
    if ((await writeDown.count()) > 0) {
      while ((await writeDown.count()) > 0) await writeDown.first().click();
      await engineer.getByRole('button', { name: 'Save variations' }).click();
      await expect.poll(() => engineer.getByText('Variations saved.').count()).toBeGreaterThan(0);
    }

    await drawSignature(engineer, engineer.getByRole('img', { name: /^Engineer’s signature/ }));
    await engineer.getByRole('button', { name: 'Save the engineer’s signature' }).click();
    await expect.poll(() => engineer.getByText(/^Signed by /).count()).toBeGreaterThan(0);
    const draft = await db('handover_drafts').where({ site_id: site.id }).first();
    expect(draft.engineer_signature).toMatch(/^data:image\/png;base64,/);

    await engineer.getByRole('radio', { name: 'Send a signing request' }).check();
    await engineer.getByRole('radio', { name: 'Helen Marsh' }).check();
    await engineer.getByRole('button', { name: 'Send signing request' }).click();
    await expect
      .poll(() => engineer.getByText(/Signing request sent to helen\.marsh@example\.com/).count())
      .toBeGreaterThan(0);

    // --- The homeowner, on a phone, from the e-mailed link -------------------------------------
    let link = '';
    await expect
      .poll(async () => {
        const mails = (await (await fetch(`${mailUrl}/api/messages`)).json()) as CapturedMail[];
        const request = mails.find(
          (mail) => mail.to.includes('helen.marsh@example.com') && /countersign/.test(mail.subject),
        );
        link = request?.text.match(/https?:\/\/\S+\/homeowner\/sign\/[0-9a-f-]{36}/)?.[0] ?? '';
        return link;
      })
      .not.toBe('');
    const phone = await browser().newContext({
      viewport: PHONE,
      hasTouch: true,
      acceptDownloads: true,
    });
    const homeowner = await phone.newPage();
    await signInAs(homeowner, db, 'homeowner', { returnTo: new URL(link).pathname });
    await homeowner.getByRole('heading', { name: 'Sign the handover', level: 1 }).waitFor();
    await homeowner.getByRole('textbox', { name: 'Your full name' }).fill('Helen Marsh');
    await drawSignature(homeowner, homeowner.getByRole('img', { name: /^Your signature/ }));
    await homeowner.getByRole('button', { name: 'Sign', exact: true }).click();
    await homeowner.getByRole('heading', { name: 'You have signed the handover' }).waitFor();

    // --- The engineer issues the pack -----------------------------------------------------------
    await engineer.reload();
    const issue = engineer.getByRole('button', { name: 'Issue the handover pack' });
    await expect.poll(() => issue.getAttribute('aria-disabled')).not.toBe('true');
    await issue.click();
    const issued = engineer.getByText(/^Pack FAS-\d{6}-R\d+ is issued$/);
    await issued.waitFor({ timeout: 60_000 });
    const packNumber = (await issued.textContent())!.match(/FAS-\d{6}-R\d+/)![0];
    const row = await db('handover_packs').where({ pack_number: packNumber }).first();
    expect(row.site_id).toBe(site.id);

    // The pack reaches the homeowner by e-mail with the PDF attached.
    await expect
      .poll(async () => {
        const mails = (await (await fetch(`${mailUrl}/api/messages`)).json()) as CapturedMail[];
        return mails.find((mail) => mail.subject.includes(packNumber))?.attachments[0]?.filename;
      })
      .toBe(`${packNumber}.pdf`);

    // --- The homeowner downloads it from Documents and verifies it on the public page ------------
    await homeowner.getByRole('link', { name: 'Go to your documents' }).click();
    await homeowner.getByRole('heading', { name: 'Documents', level: 1 }).waitFor();
    const [download] = await Promise.all([
      homeowner.waitForEvent('download'),
      homeowner.getByRole('link', { name: `Download pack ${packNumber}` }).click(),
    ]);
    const bytes = await readFile((await download.path())!);
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    expect(createHash('sha256').update(bytes).digest('hex')).toBe(row.sha256);

    await homeowner.getByRole('link', { name: `Verify pack ${packNumber}` }).click();
    await homeowner.waitForURL(`${apiUrl}/verify/${packNumber}`);
    await homeowner.getByRole('heading', { name: packNumber, level: 1 }).waitFor();
    await expect.poll(() => homeowner.getByText('Seal checks out').count()).toBeGreaterThan(0);
    expect(await homeowner.locator('main').textContent()).toContain(row.sha256);
    await homeowner.getByLabel('PDF file').setInputFiles({
      name: `${packNumber}.pdf`,
      mimeType: 'application/pdf',
      buffer: bytes,
    });
    await homeowner.getByRole('button', { name: 'Check this file' }).click();
    await expect
      .poll(() => homeowner.getByText('This file matches the issued pack byte for byte').count())
      .toBeGreaterThan(0);

    // A copy changed by one byte does not pass.
    const altered = Buffer.from(bytes);
    altered[Math.floor(altered.length / 2)] = altered[Math.floor(altered.length / 2)]! ^ 0x01;
    await homeowner.getByLabel('PDF file').setInputFiles({
      name: 'altered.pdf',
      mimeType: 'application/pdf',
      buffer: altered,
    });
    await homeowner.getByRole('button', { name: 'Check this file' }).click();
    await expect
      .poll(() => homeowner.getByText('This file does not match the issued pack').count())
      .toBeGreaterThan(0);
    await desk.close();
    await phone.close();
  });
});
