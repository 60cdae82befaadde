import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { wcagViolations } from '../setup/axe';
import { signInAs } from '../setup/browser-sign-in';
import { closeTestDb, testDb } from '../setup/database';
import { startTestReceiver, type TestReceiver } from '../setup/test-receiver';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const browser = useChromium();
const db = testDb();
const { apiUrl, smsUrl } = inject('stack');
const DESK = { width: 1600, height: 900 };
let receiver: TestReceiver;

beforeAll(async () => {
  receiver = await startTestReceiver(db);
});
afterAll(async () => {
  await receiver.stop();
  await closeTestDb();
});

interface FakeMessage {
  direction: 'inbound' | 'outbound';
  to: string;
  from: string;
  body: string;
}

async function textsTo(phone: string): Promise<FakeMessage[]> {
  const response = await fetch(`${smsUrl}/api/messages`);
  const messages = (await response.json()) as FakeMessage[];
  return messages.filter((message) => message.direction === 'outbound' && message.to === phone);
}

/** Text in the page's main region, for polling on what the operator can read. */
const mainText = (page: Page) => page.locator('main').innerText();

describe('an operator working an alarm', () => {
  it('sees it arrive without reloading, takes it, texts the keyholder, sees the reply and closes it', async () => {
    const site = await db('sites')
      .where({ name: 'Marsh residence' })
      .first('id', 'monitoring_account', 'address_line1', 'postcode');
    const firstKeyholder = await db('keyholders')
      .where({ site_id: site.id, call_order: 1 })
      .first('name', 'phone');
    const textsBefore = (await textsTo(firstKeyholder.phone)).length;

    const context = await browser().newContext({ viewport: DESK });
    const page = await context.newPage();
    await signInAs(page, db, 'operator');
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toBe('Operator home');
    // The queue is fed by the live stream: wait until it is connected before the alarm.
    await expect.poll(() => page.getByText('Live', { exact: true }).count()).toBe(1);
    await page.evaluate(() => {
      (window as unknown as { sameDocument: boolean }).sameDocument = true;
    });

    // Contact ID 130 (burglary), new, zone 3, through the real receiver over TCP.
    const eventId = await receiver.send({
      format: 'adm-cid',
      account: site.monitoring_account,
      code: '130',
      zone: 3,
      partition: 1,
      qualifier: 'new',
      sequence: 6101,
    });
    expect(eventId).not.toBeNull();

    const row = page.locator(`tr[data-event-id="${eventId}"]`);
    await expect.poll(() => row.count()).toBe(1);
    expect(await row.innerText()).toContain('Marsh residence');
    expect(await row.innerText()).toMatch(/Waiting to be taken/);
    expect(await row.innerText()).toMatch(/Intruder alarm/);
    // Arrived by the server-sent events stream: the page was never reloaded.
    expect(
      await page.evaluate(() => (window as unknown as { sameDocument?: boolean }).sameDocument),
    ).toBe(true);
    expect(await wcagViolations(page)).toEqual([]);

    await row.getByRole('link', { name: /Intruder alarm.* at Marsh residence/ }).click();
    await page.waitForURL(`${apiUrl}/operator/events/${eventId}`);
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toBe('Intruder alarm at Marsh residence');
    // The call plan rings from the screen, and police response explains why it is not offered.
    expect(await page.locator(`a[href="tel:${firstKeyholder.phone}"]`).count()).toBeGreaterThan(0);
    await expect.poll(() => mainText(page)).toMatch(/Unconfirmed intruder alarm/);
    expect(await page.getByRole('button', { name: 'Record the police request' }).count()).toBe(0);

    await page.getByRole('button', { name: 'Take this event' }).click();
    await expect.poll(() => mainText(page)).toContain('Taken by you');
    await expect.poll(() => mainText(page)).toMatch(/Tell every keyholder you send/);
    // Focus moves on to the call-out, the first thing to do once the event is yours.
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe(
      'Keyholder call-out',
    );
    expect(await wcagViolations(page)).toEqual([]);

    await page.getByRole('button', { name: 'Text keyholders in call order' }).click();
    await expect
      .poll(async () => (await textsTo(firstKeyholder.phone)).length)
      .toBe(textsBefore + 1);
    // The fake lists its messages newest first.
    const text = (await textsTo(firstKeyholder.phone))[0]!;
    expect(text.body).toContain('Marsh residence');
    // Texts go to phones others may read: no street address, no postcode.
    expect(text.body).not.toContain(site.address_line1);
    expect(text.body).not.toContain(site.postcode);
    const texts = page.getByRole('region', { name: 'Texts to keyholders' });
    await expect.poll(() => texts.innerText()).toContain(firstKeyholder.name);

    // The keyholder answers "1" on the local SMS page, as a person trying Wardbook would; the
    // fake posts it to the app's webhook, signed as Twilio signs.
    const phone = await page.context().newPage();
    await phone.goto(smsUrl);
    await phone.getByLabel(`Reply as ${firstKeyholder.phone}`).fill('1');
    await phone.getByRole('button', { name: 'Send reply' }).click();
    await phone.waitForURL(`${smsUrl}/#conversation-${firstKeyholder.phone.slice(1)}`);
    await phone.close();
    await expect.poll(() => texts.innerText()).toContain('Attending');
    await expect.poll(() => mainText(page)).toContain(`${firstKeyholder.name} is attending`);
    const timeline = page.getByRole('log', { name: 'Timeline' });
    await expect.poll(() => timeline.innerText()).toMatch(/replied 1: attending/);
    const timelineText = await timeline.innerText();
    expect(timelineText).toMatch(/Taken by Priya Nandakumar/);
    expect(timelineText).toMatch(/started messaging keyholders/);

    // A phone call to someone outside the call plan: the name is asked for before anything goes.
    const callForm = page.getByRole('region', { name: 'Record a phone call' });
    await callForm.getByLabel('Who did you call?').selectOption({ label: 'Someone else' });
    await callForm.getByLabel('What came of it?').selectOption('other');
    await callForm.getByLabel(/^Note/).fill('Asked them to log the activation.');
    await callForm.getByRole('button', { name: 'Record the call' }).click();
    await expect.poll(() => callForm.innerText()).toContain('Say who you called.');
    expect(await callForm.getByLabel(/^Note/).inputValue()).toBe(
      'Asked them to log the activation.',
    );
    await callForm.getByLabel('Their name').fill('Police control room');
    await callForm.getByRole('button', { name: 'Record the call' }).click();
    await expect
      .poll(() => timeline.innerText())
      .toMatch(/Called Police control room: see note\. Asked them to log the activation\./);

    // Closing asks for an outcome, keeping the note typed; then closes once confirmed.
    const closeForm = page.getByRole('region', { name: 'Close the event' });
    const closeNote = 'Homeowner set it off coming home; password given.';
    await closeForm.getByLabel(/^Note/).fill(closeNote);
    await closeForm.getByRole('button', { name: 'Close the event…' }).click();
    await expect.poll(() => closeForm.innerText()).toContain('Choose how the event ended.');
    expect(await closeForm.getByLabel(/^Note/).inputValue()).toBe(closeNote);
    await closeForm.getByLabel('Outcome').selectOption('false_alarm_user');
    await closeForm.getByRole('button', { name: 'Close the event…' }).click();
    await closeForm.getByRole('button', { name: 'Yes, close the event' }).click();
    await expect.poll(() => timeline.innerText()).toMatch(/Closed: False alarm: user error/);
    expect(await mainText(page)).toContain('False alarm: user error');
    const stored = await db('alarm_events').where({ id: eventId }).first('status', 'outcome');
    expect(stored).toEqual({ status: 'closed', outcome: 'false_alarm_user' });

    // Back on the queue it has left the active tab for the closed one.
    await page.getByRole('link', { name: 'Signal queue' }).click();
    await expect.poll(() => page.getByText('Live', { exact: true }).count()).toBe(1);
    await expect.poll(() => page.locator(`tr[data-event-id="${eventId}"]`).count()).toBe(0);
    await page.getByRole('link', { name: 'Recently closed' }).click();
    await expect
      .poll(() =>
        page.getByRole('region', { name: 'Recently closed events, newest first' }).innerText(),
      )
      .toContain('False alarm: user error');
    await context.close();
  });
});
