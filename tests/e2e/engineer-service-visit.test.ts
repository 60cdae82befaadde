import type { Locator, Page } from 'playwright-core';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { siteEngineering } from '../../server/engineering/site-engineering';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-scenario';
import { wcagViolations } from '../setup/axe';
import { signInAs } from '../setup/browser-sign-in';
import { closeTestDb, testDb } from '../setup/database';
import { useChromium } from '../setup/use-chromium';
import '../setup/provided';

const browser = useChromium();
const db = testDb();
const PHONE = { width: 390, height: 844 };
const { apiUrl } = inject('stack');

// What these tests add to the shared demo site is taken away again, so the plan and history
// other browser tests read are as the seed left them.
const visitIds: string[] = [];
const faultReportIds: string[] = [];
afterAll(async () => {
  if (faultReportIds.length > 0) {
    const photoFiles = await db('fault_report_photos')
      .whereIn('fault_report_id', faultReportIds)
      .pluck('site_file_id');
    await db('fault_reports').whereIn('id', faultReportIds).delete();
    if (photoFiles.length > 0) await db('site_files').whereIn('id', photoFiles).delete();
  }
  if (visitIds.length > 0) await db('service_visits').whereIn('id', visitIds).delete();
  await closeTestDb();
});

/** What a meter would show for a band's nominal value: ohms to two places, or OL when open. */
const meterReading = (ohms: number) =>
  Number.isFinite(ohms) ? String(Math.round(ohms * 100) / 100) : 'OL';

const ukToday = () =>
  new Intl.DateTimeFormat('en-CA', {
    timeZone: 'Europe/London',
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).format(new Date());

async function drawSignature(page: Page, canvas: Locator) {
  await canvas.scrollIntoViewIfNeeded();
  const box = (await canvas.boundingBox())!;
  const y = box.y + box.height * 0.5;
  await page.mouse.move(box.x + box.width * 0.2, y);
  await page.mouse.down();
  for (let step = 1; step <= 20; step += 1) {
    const x = box.x + box.width * (0.2 + (0.6 * step) / 20);
    await page.mouse.move(x, y - Math.cos(step / 2) * box.height * 0.2, { steps: 2 });
  }
  await page.mouse.up();
}

const fitsThePhone = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth);

describe('service visits from the engineer’s phone to the homeowner’s history', () => {
  it('the engineer completes a booked preventive visit on a phone and the homeowner sees it', async () => {
    const site = await db('sites').where({ name: 'Marsh residence' }).first('id', 'name');
    const engineerAccount = DEMO_ACCOUNTS.find((account) => account.role === 'engineer')!;
    const engineer = await db('users')
      .whereRaw('lower(email) = ?', [engineerAccount.email])
      .first('id');
    // The office's booking, made straight in the database: today, with the demo engineer.
    const [visit] = await db('service_visits')
      .insert({
        site_id: site.id,
        kind: 'preventive',
        status: 'scheduled',
        due_date: ukToday(),
        scheduled_for: new Date(),
        engineer_id: engineer.id,
      })
      .returning('id');
    visitIds.push(visit.id);
    const engineering = await siteEngineering(db, site.id);
    const zones = [...engineering!.zones].sort((a, b) => a.number - b.number);
    expect(zones.length).toBeGreaterThan(0);

    const context = await browser().newContext({ viewport: PHONE, hasTouch: true });
    const page = await context.newPage();
    await signInAs(page, db, 'engineer');
    await page.goto(`${apiUrl}/engineer/service?visit=${visit.id}`);
    await page.getByRole('link', { name: 'Complete this visit' }).click();
    await page.getByRole('heading', { level: 1, name: 'Complete this visit' }).waitFor();

    // The site work cautions are on the form's screen (HSE INDG455 ladders, BS 7671 mains).
    const cautions = await page.locator('main').innerText();
    expect(cautions).toMatch(/1-in-4 angle/);
    expect(cautions).toMatch(/hidden cables and pipes/);
    expect(cautions).toMatch(/isolate the mains supply/);
    expect(cautions).toMatch(/Asbestos/);

    // Sending an empty form keeps it on screen, with the reason beside each field.
    await page.getByRole('button', { name: 'Complete the visit' }).click();
    await expect
      .poll(() => page.locator('main').innerText())
      .toContain('Enter the voltage at rest in volts, e.g. 12.8.');
    expect(await page.locator('main').innerText()).toContain(
      'Say whether you went through using the system with the customer.',
    );

    // Battery within the usual 12 V lead-acid figures (from memory: ≥ 12.5 V at rest, ≥ 12.0 V
    // under load, as server/commissioning/schema.ts states them).
    await page.getByLabel('Volts at rest', { exact: true }).fill('13.6');
    await page.getByLabel('Volts under load', { exact: true }).fill('12.6');

    for (const [index, zone] of zones.entries()) {
      const name = `Zone ${zone.number} ${zone.location}`;
      const normal = zone.bands.find((band) => band.state === 'normal')!;
      const alarm = zone.bands.find((band) => band.state === 'alarm');
      await page
        .getByLabel(`${name}: secure reading`, { exact: true })
        .fill(meterReading(normal.nominalOhms));
      if (index === 0) {
        // The live classification, worked out on the phone as the reading is typed.
        const item = page.getByRole('listitem').filter({ hasText: `${name}: secure reading` });
        await expect.poll(() => item.innerText()).toContain('as expected');
      }
      await page
        .getByLabel(new RegExp(`^${name}: reading in alarm`))
        .fill(alarm ? meterReading(alarm.nominalOhms) : 'OL');
      await page
        .getByRole('group', { name: `${name}: did the panel show it when walked?` })
        .getByLabel('Yes')
        .check();
    }

    await page.getByRole('group', { name: 'Tampers' }).getByLabel('Passed').check();
    await page.getByRole('group', { name: 'Internal sounders' }).getByLabel('Passed').check();
    // One thing left untested: the customer must sign for it.
    await page.getByRole('group', { name: 'External sounders' }).getByLabel('Not tested').check();
    await page
      .getByLabel('Why the external sounders were not tested', { exact: true })
      .fill('Bell box over the conservatory roof: no safe footing for a ladder today.');
    const signalling = page.getByRole('region', { name: 'Signalling' });
    for (const group of await signalling.getByRole('group').all()) {
      await group.getByLabel('Passed').check();
    }
    await page
      .getByRole('group', { name: 'Did you go through using the system with the customer?' })
      .getByLabel('Yes')
      .check();
    await page.getByLabel('4: confident', { exact: true }).check();

    await page.getByRole('button', { name: 'Complete the visit' }).click();
    await expect
      .poll(() => page.locator('main').innerText())
      .toContain('The customer signs for what was not tested: enter their name.');

    await page.getByLabel('Customer’s full name', { exact: true }).fill('Helen Marsh');
    await drawSignature(page, page.getByRole('img', { name: /^Customer’s signature/ }));
    expect(await fitsThePhone(page)).toBeLessThanOrEqual(PHONE.width);
    expect(await wcagViolations(page)).toEqual([]);

    await page.getByRole('button', { name: 'Complete the visit' }).click();
    const recorded = page.getByRole('status').filter({ hasText: 'Visit recorded' });
    await recorded.waitFor();
    // The API's verdict on the battery, shown once saved.
    expect(await page.locator('main').innerText()).toContain('Battery: passed');
    expect(await recorded.innerText()).toContain('Signed for by Helen Marsh');

    const saved = await db('service_visits').where({ id: visit.id }).first();
    expect(saved.status).toBe('done');
    expect(saved.completion_key).toMatch(/^[0-9a-f-]{36}$/);
    expect(saved.customer_name).toBe('Helen Marsh');
    expect(saved.checklist.notTested).toHaveLength(1);
    expect(saved.checklist.zones).toHaveLength(zones.length);
    await context.close();

    // The homeowner, on their phone, finds it at the top of their home's service history.
    const homeContext = await browser().newContext({ viewport: PHONE, hasTouch: true });
    const home = await homeContext.newPage();
    await signInAs(home, db, 'homeowner');
    await home.goto(`${apiUrl}/homeowner/homes/${site.id}`);
    await home.getByRole('link', { name: 'Service history' }).click();
    const timeline = home.getByRole('list', { name: 'Service history, newest first' });
    await timeline.waitFor();
    const entry = timeline
      .locator(':scope > li')
      .filter({ hasText: 'Preventive visit done' })
      .filter({ hasText: saved.checklist.outcome.words })
      .first();
    await entry.waitFor();
    expect(await entry.innerText()).toContain(`Engineer: ${engineerAccount.displayName}`);
    expect(await fitsThePhone(home)).toBeLessThanOrEqual(PHONE.width);
    expect(await wcagViolations(home)).toEqual([]);
    await homeContext.close();
  });

  it('the engineer completes a call-out on a phone, and a resend after a lost reply records it once', async () => {
    const site = await db('sites').where({ name: 'Marsh residence' }).first('id');
    const engineerAccount = DEMO_ACCOUNTS.find((account) => account.role === 'engineer')!;
    const engineer = await db('users')
      .whereRaw('lower(email) = ?', [engineerAccount.email])
      .first('id');
    const today = ukToday();
    const [visit] = await db('service_visits')
      .insert({
        site_id: site.id,
        kind: 'corrective',
        status: 'scheduled',
        due_date: today,
        engineer_id: engineer.id,
        reported_fault: 'Landing detector shows a fault on the keypad.',
      })
      .returning('id');
    visitIds.push(visit.id);

    const context = await browser().newContext({ viewport: PHONE, hasTouch: true });
    const page = await context.newPage();
    await signInAs(page, db, 'engineer');
    await page.goto(`${apiUrl}/engineer/service/visits/${visit.id}/complete?day=${today}`);
    const found = page.getByLabel('Fault as found', { exact: true });
    await found.waitFor();
    expect(await found.inputValue()).toBe('Landing detector shows a fault on the keypad.');
    expect(await page.locator('main').innerText()).toMatch(/hidden cables and pipes/);

    await page.getByRole('button', { name: 'Complete the call-out' }).click();
    await expect.poll(() => page.locator('main').innerText()).toMatch(/Choose the prime cause: /);

    await page.getByLabel('Prime cause', { exact: true }).selectOption('equipment_fault');
    await page
      .getByLabel('What you did', { exact: true })
      .fill('Replaced the landing detector; walk-tested the zone.');
    await page.getByRole('button', { name: 'Add a part' }).click();
    await page.getByLabel('Part 1', { exact: true }).fill('Dual-technology detector');
    const falseAlarm = page.getByRole('group', { name: 'Did the call-out follow a false alarm?' });
    // A false alarm needs its cause, said beside the field; then the engineer corrects the answer.
    await falseAlarm.getByLabel('Yes').check();
    await page.getByRole('button', { name: 'Complete the call-out' }).click();
    await expect
      .poll(() => page.locator('main').innerText())
      .toContain('Say what caused the false alarm');
    await falseAlarm.getByLabel('No').check();

    // The first reply is lost on the way back to the phone (the server has recorded it).
    let dropped = 0;
    await page.route(`**/api/service/visits/${visit.id}/complete`, async (route) => {
      if (dropped > 0) return route.continue();
      dropped += 1;
      await route.fetch();
      await route.abort('connectionreset');
    });
    await page.getByRole('button', { name: 'Complete the call-out' }).click();
    await expect
      .poll(() => page.locator('main').innerText())
      .toContain('The call-out was not completed.');
    expect(await page.getByLabel('What you did', { exact: true }).inputValue()).toBe(
      'Replaced the landing detector; walk-tested the zone.',
    );

    await page.getByRole('button', { name: 'Complete the call-out' }).click();
    await page.getByRole('status').filter({ hasText: 'Visit recorded' }).waitFor();
    expect(dropped).toBe(1);

    const saved = await db('service_visits').where({ id: visit.id }).first();
    expect(saved.status).toBe('done');
    expect(saved.prime_cause).toBe('equipment_fault');
    expect(saved.parts_replaced).toEqual([{ part: 'Dual-technology detector', quantity: 1 }]);
    // Sent twice, recorded once: one completion in the audit log.
    const completions = await db('audit_log').where({
      entity_id: visit.id,
      action: 'service_visit.completed',
    });
    expect(completions).toHaveLength(1);
    await context.close();
  });

  it('the homeowner reports a fault with a photo and is told it has been received', async () => {
    const site = await db('sites').where({ name: 'Marsh residence' }).first('id');
    const context = await browser().newContext({ viewport: PHONE, hasTouch: true });
    const page = await context.newPage();
    await signInAs(page, db, 'homeowner');
    await page.goto(`${apiUrl}/homeowner/homes/${site.id}/service`);
    const main = page.locator('main');
    await page.getByRole('heading', { name: 'Report a fault' }).waitFor();
    // Cautions before looking at a fault: no panels, no climbing, no going in after a break-in.
    const cautions = await main.innerText();
    expect(cautions).toContain('Do not open the control panel');
    expect(cautions).toContain('Do not climb');
    expect(cautions).toContain('call the police on 999');

    // Too short a description is refused beside the field, and nothing is sent.
    await page.getByLabel('What is wrong?', { exact: true }).fill('Hmm');
    await page.getByRole('button', { name: 'Send the fault report' }).click();
    await expect.poll(() => main.innerText()).toContain('Say a little more about what is wrong.');
    expect(await db('fault_reports').where({ site_id: site.id, description: 'Hmm' })).toHaveLength(
      0,
    );

    const description = `The keypad in the hall beeps every few minutes (${Date.now()}).`;
    await page.getByLabel('What is wrong?', { exact: true }).fill(description);
    await page.getByLabel(/^Photos/).setInputFiles({
      name: 'hall-keypad.png',
      mimeType: 'image/png',
      buffer: Buffer.from(
        'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAIAAACQd1PeAAAADElEQVR4nGP4z8AAAAMBAQDJ/pLvAAAAAElFTkSuQmCC',
        'base64',
      ),
    });
    await page.getByRole('button', { name: 'Send the fault report' }).click();
    const acknowledgement = page.getByRole('status').filter({ hasText: 'Thank you' });
    await acknowledgement.waitFor();
    expect(await acknowledgement.innerText()).toContain('1 photo is attached.');

    const reports = await db('fault_reports').where({ site_id: site.id, description });
    faultReportIds.push(...reports.map((report) => report.id as string));
    expect(reports).toHaveLength(1);
    const timeline = page.getByRole('list', { name: 'Service history, newest first' });
    await expect.poll(() => timeline.innerText()).toContain(description);
    await context.close();

    // The report lands in the office's queue, where a call-out is booked from it.
    const office = await browser().newContext({ viewport: { width: 1280, height: 900 } });
    const desk = await office.newPage();
    await signInAs(desk, db, 'office');
    await desk.goto(`${apiUrl}/office/service`);
    const queue = desk.getByRole('region', { name: 'Faults reported by homeowners' });
    const row = queue.getByRole('row').filter({ hasText: description });
    await row.waitFor();
    await row.getByRole('button', { name: /^Book a call-out/ }).click();
    await expect.poll(() => row.innerText()).toContain('A visit is booked');
    const booked = await db('fault_reports').where({ id: reports[0]!.id }).first('visit_id');
    expect(booked.visit_id).toBeTruthy();
    visitIds.push(booked.visit_id as string);
    expect(await wcagViolations(desk)).toEqual([]);
    await office.close();
  });
});
