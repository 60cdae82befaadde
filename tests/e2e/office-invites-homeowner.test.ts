import { afterAll, describe, expect, inject, it } from 'vitest';
import { signInAs } from '../setup/browser-sign-in';
import { closeTestDb, testDb } from '../setup/database';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const browser = useChromium();
const db = testDb();
const { apiUrl, idpUrl, mailUrl } = inject('stack');
afterAll(closeTestDb);

interface CapturedMail {
  to: string[];
  subject: string;
  text: string;
}

async function mailTo(address: string): Promise<CapturedMail> {
  for (let attempt = 0; attempt < 50; attempt++) {
    const mails = (await (await fetch(`${mailUrl}/api/messages`)).json()) as CapturedMail[];
    const found = mails.find((mail) => mail.to.includes(address));
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`no e-mail reached ${address}`);
}

describe('the office invites a homeowner', () => {
  it('who sets a password from the e-mailed link, signs in and finds their home', async () => {
    const office = await browser().newContext({ viewport: { width: 1366, height: 900 } });
    const page = await office.newPage();
    await signInAs(page, db, 'office');
    const site = await db('sites').where({ reference: 'S-0003' }).first();
    await page.goto(`${apiUrl}/office/sites/${site.id}`);
    await page.getByLabel('Full name').fill('Noor Castellano');
    await page.getByLabel('E-mail address').fill('noor.castellano@example.com');
    await page.getByRole('button', { name: 'Invite homeowner' }).click();
    await expect
      .poll(() => page.getByText('noor.castellano@example.com').count())
      .toBeGreaterThan(0);
    await office.close();

    const mail = await mailTo('noor.castellano@example.com');
    expect(mail.subject).toBe('You are invited to Wardbook');
    const link = mail.text.match(/http:\/\/\S+\/password\/reset\/\S+/)![0];
    expect(link.startsWith(idpUrl)).toBe(true);

    const phone = await browser().newContext({ viewport: { width: 390, height: 844 } });
    const homeowner = await phone.newPage();
    await homeowner.goto(link);
    await expect
      .poll(() => homeowner.getByRole('heading', { level: 1 }).textContent())
      .toBe('Choose your password');
    await homeowner.getByLabel('New password', { exact: true }).fill('lantern harbour copper');
    await homeowner.getByLabel('New password again').fill('lantern harbour copper');
    await homeowner.getByRole('button', { name: 'Save password' }).click();
    await homeowner.getByRole('link', { name: 'Sign in to Wardbook' }).click();
    await homeowner.getByLabel('E-mail address').fill('noor.castellano@example.com');
    await homeowner.getByLabel('Password').fill('lantern harbour copper');
    await homeowner.getByRole('button', { name: 'Sign in' }).click();
    await homeowner.waitForURL(`${apiUrl}/homeowner**`);
    await expect
      .poll(() => homeowner.getByRole('heading', { level: 1 }).textContent())
      .toBe('My home');
    await expect.poll(() => homeowner.locator('main').textContent()).toContain(site.name);

    // Their home's files: a photo uploaded from the phone, with its progress shown.
    await homeowner
      .getByRole('link', { name: new RegExp(site.name) })
      .first()
      .click();
    await homeowner.getByRole('link', { name: 'Files' }).first().click();
    await homeowner.getByLabel('File to upload').setInputFiles({
      name: 'hall-sensor.png',
      mimeType: 'image/png',
      buffer: Buffer.from(
        'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAIAAACQd1PeAAAADElEQVR4nGP4z8AAAAMBAQDJ/pLvAAAAAElFTkSuQmCC',
        'base64',
      ),
    });
    await homeowner.getByRole('button', { name: 'Upload file' }).click();
    await expect.poll(() => homeowner.getByText('hall-sensor.png').count()).toBeGreaterThan(0);
    const stored = await db('site_files')
      .where({ site_id: site.id, file_name: 'hall-sensor.png' })
      .first();
    expect(stored).toMatchObject({ content_type: 'image/png' });
    await phone.close();
  });
});
