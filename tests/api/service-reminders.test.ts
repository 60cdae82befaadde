import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LOCAL_TWILIO_ACCOUNT_SID, LOCAL_TWILIO_FROM } from '../../server/config/config';
import { createTwilioFake, type TwilioFake } from '../../server/fakes/twilio/app';
import { createLogger } from '../../server/http/logger';
import { sendServiceReminders } from '../../server/service-reminders/sweep';
import { createSmsSender } from '../../server/sms/sender';
import { useSiteWorld, type SiteWorld } from '../setup/site-fixtures';

/*
 * Service reminders, one pass at a time on a chosen day. The site is monitored, so its plan is
 * two preventive visits a year (../shared/checks.md, from memory of PD 6662 / BS 9263
 * practice): a visit done on 10 June 2026 makes the next one due on 10 December 2026.
 */
const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;
let fake: TwilioFake;
let fakeServer: Server;
const authToken = randomBytes(16).toString('hex');
const HOMEOWNER_MOBILE = '+447700900177';

beforeAll(async () => {
  world = currentWorld();
  fakeServer = createServer();
  await new Promise<void>((resolve) => fakeServer.listen(0, '127.0.0.1', () => resolve()));
  const fakeUrl = `http://127.0.0.1:${(fakeServer.address() as AddressInfo).port}`;
  fake = createTwilioFake({
    accountSid: LOCAL_TWILIO_ACCOUNT_SID,
    authToken,
    publicUrl: fakeUrl,
    phoneNumber: LOCAL_TWILIO_FROM,
    statusStepMs: 10,
  });
  fakeServer.on('request', fake.app);
  await db('users').where({ id: world.homeowner.userId }).update({ phone: HOMEOWNER_MOBILE });
  await db('service_visits').insert({
    site_id: world.own.siteId,
    kind: 'preventive',
    status: 'done',
    due_date: '2026-06-10',
    completed_at: new Date('2026-06-10T10:00:00Z'),
    plan_visits_per_year: 2,
  });
});

afterAll(async () => {
  fake.close();
  fakeServer.closeAllConnections();
  await new Promise((resolve) => fakeServer.close(resolve));
});

function deps() {
  return {
    db,
    mailer: harness.mailer,
    logger: createLogger('silent', 'test'),
    sms: createSmsSender({
      accountSid: LOCAL_TWILIO_ACCOUNT_SID,
      authToken,
      from: LOCAL_TWILIO_FROM,
      apiBaseUrl: `http://127.0.0.1:${(fakeServer.address() as AddressInfo).port}`,
    }),
  };
}

const mailsTo = (address: string) =>
  harness.mailbox.list().filter((mail) => mail.to.includes(address));

describe('service reminders', () => {
  it('tells the homeowner by e-mail and text when a visit is due soon, once however often the sweep runs', async () => {
    await sendServiceReminders(deps(), '2026-12-01');
    await expect.poll(() => mailsTo(world.homeowner.email).length).toBe(1);
    const mail = mailsTo(world.homeowner.email)[0]!;
    expect(mail.subject).toBe('Your alarm is due its service visit on 10 December 2026');
    const texts = fake.inbox.list().filter((message) => message.to === HOMEOWNER_MOBILE);
    expect(texts).toHaveLength(1);
    expect(texts[0]!.body).toContain('10 December 2026');
    expect(texts[0]!.body).not.toContain('Test Street');

    // A second pass the same day, and two more at once, as two API processes might run them.
    await sendServiceReminders(deps(), '2026-12-01');
    await Promise.all([
      sendServiceReminders(deps(), '2026-12-02'),
      sendServiceReminders(deps(), '2026-12-02'),
    ]);
    await new Promise((resolve) => setTimeout(resolve, 500));
    expect(mailsTo(world.homeowner.email)).toHaveLength(1);
    expect(fake.inbox.list().filter((message) => message.to === HOMEOWNER_MOBILE)).toHaveLength(1);
    const rows = await db('service_reminders').where({ site_id: world.own.siteId });
    expect(rows.map((row) => `${row.kind}/${row.channel}/${row.status}`).sort()).toEqual([
      'visit_due_soon/email/sent',
      'visit_due_soon/sms/sent',
    ]);
  });

  it('says nothing more than 14 days ahead', async () => {
    await db('service_visits').where({ site_id: world.other.siteId }).delete();
    await db('service_visits').insert({
      site_id: world.other.siteId,
      kind: 'preventive',
      status: 'done',
      due_date: '2026-07-20',
      completed_at: new Date('2026-07-20T10:00:00Z'),
      plan_visits_per_year: 2,
    });
    await sendServiceReminders(deps(), '2026-12-01');
    expect(await db('service_reminders').where({ site_id: world.other.siteId })).toEqual([]);
  });

  it('tells the installer’s office once when the visit is overdue', async () => {
    await sendServiceReminders(deps(), '2026-12-20');
    await expect.poll(() => mailsTo(world.office.email).length).toBe(1);
    const mail = mailsTo(world.office.email)[0]!;
    expect(mail.subject).toMatch(/^Service visit overdue: /);
    expect(mail.text).toContain('was due on 10 December 2026: 10 days ago.');
    expect(mail.text).toContain('No visit is booked yet');
    await sendServiceReminders(deps(), '2026-12-21');
    await new Promise((resolve) => setTimeout(resolve, 500));
    expect(mailsTo(world.office.email)).toHaveLength(1);
  });
});
