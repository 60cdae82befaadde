import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes, randomUUID } from 'node:crypto';
import { createServer, get, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { pathToFileURL } from 'node:url';
import type { Knex } from 'knex';
import pg from 'pg';
import { createApp } from '../server/app';
import { createOidcClient } from '../server/auth/oidc-client';
import { createSessionStore } from '../server/auth/session';
import { stopProcess } from '../server/cli/processes';
import { LOCAL_TWILIO_ACCOUNT_SID, LOCAL_TWILIO_FROM, loadConfig } from '../server/config/config';
import { createDb, type DatabaseConnection } from '../server/db/knex';
import { migrateToLatest } from '../server/db/migrate';
import { createLocalDiskStorage } from '../server/files/storage';
import { createLogger } from '../server/http/logger';
import { createTwilioFake } from '../server/fakes/twilio/app';
import { createSmtpMailer } from '../server/mail/mailer';
import { startCallOutEngine } from '../server/monitoring/callout/engine';
import { simulatedFrame } from '../server/monitoring/simulator';
import { repoRoot } from '../server/paths';
import { createSmsSender } from '../server/sms/sender';
import { everydaySignal, isAckFor, openPanelLink, type PanelLink } from '../tests/setup/panel-link';
import { freePort, startReceiverProcess } from '../tests/setup/receiver-process';
import { benchDatabase } from './lib/database';
import { median, percentile } from './lib/load';
import { sessionCookie } from './records';

/**
 * Issue 6's benchmark, the alarm signal path: the real receiver process (acknowledge after
 * commit) on a fresh database, measured against a receiver that acknowledges from memory.
 *   1. sustained signals per second, panels each sending their next frame on its ACK;
 *   2. acknowledge latency at a fixed offered rate, timed from when each frame was due;
 *   3. signal to operator screen: frame sent until the operator's live stream says so;
 *   4. signal to keyholder SMS at the local Twilio fake.
 * Prints figures, never passes or fails on them. `npm run bench -- signals` or
 * `npx tsx bench/signals.ts` runs it alone.
 */
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const PANELS = 20;
const SECONDS = Number(process.env.BENCH_SIGNAL_SECONDS ?? 10);
const OFFERED_PER_SECOND = 200;
const SCREEN_SIGNALS = 200;
const SMS_SIGNALS = 100;

interface BenchCentre {
  installerId: string;
  centreId: string;
  operatorUserId: string;
}

const ms = (value: number) => `${value.toFixed(1)} ms`;
const list = (values: number[], digits = 0) => values.map((v) => v.toFixed(digits)).join(', ');

async function seedCentre(db: Knex): Promise<BenchCentre> {
  const [installer] = await db('organisations')
    .insert({ kind: 'installer', name: 'Bench Alarms Ltd' })
    .returning('id');
  const [centre] = await db('organisations')
    .insert({ kind: 'monitoring_centre', name: 'Bench Watch Centre' })
    .returning('id');
  const [operator] = await db('users')
    .insert({
      idp_subject: randomUUID(),
      email: 'bench.operator@example.com',
      display_name: 'Bench Operator',
    })
    .returning('id');
  await db('memberships').insert({
    user_id: operator.id,
    role: 'operator',
    organisation_id: centre.id,
  });
  return { installerId: installer.id, centreId: centre.id, operatorUserId: operator.id };
}

interface BenchSite {
  account: string;
  name: string;
  keyholderPhone: string;
}

let sitesMade = 0;

/**
 * Monitored sites with fresh accounts, each with one keyholder. Each run gets its own, so a
 * frame is never a resend of an earlier run's (same account, sequence and data).
 */
async function monitoredSites(db: Knex, centre: BenchCentre, count: number): Promise<BenchSite[]> {
  const made: BenchSite[] = [];
  for (let index = 0; index < count; index++) {
    const n = ++sitesMade;
    const site = {
      account: (0x10000 + n).toString(16).toUpperCase(),
      name: `Bench site ${n}`,
      // Ofcom's drama range, 07700 900000–900999: never a real phone.
      keyholderPhone: `+447700900${String(n % 1000).padStart(3, '0')}`,
    };
    const [row] = await db('sites')
      .insert({
        installer_id: centre.installerId,
        reference: `B-${String(n).padStart(5, '0')}`,
        name: site.name,
        premises_type: 'domestic',
        address_line1: `${n} Bench Road`,
        town: 'Eastmere',
        postcode: 'EM1 1AA',
        required_grade: 2,
        environmental_class: 2,
        monitoring_centre_id: centre.centreId,
        monitoring_account: site.account,
      })
      .returning('id');
    await db('keyholders').insert({
      site_id: row.id,
      call_order: 1,
      name: `Bench Keyholder ${n}`,
      phone: site.keyholderPhone,
      minutes_to_attend: 10,
    });
    made.push(site);
  }
  return made;
}

const newAccounts = async (db: Knex, centre: BenchCentre, count: number) =>
  (await monitoredSites(db, centre, count)).map((site) => site.account);

/** An intruder alarm (Contact ID 130) from the site's panel. */
const intruderAlarm = (account: string) =>
  simulatedFrame({
    format: 'adm-cid',
    account,
    code: '130',
    zone: 3,
    partition: 1,
    qualifier: 'new',
    sequence: 1,
    receiver: '1',
    linePrefix: '1',
  });

/** The in-memory yardstick (bench/signal-reference.ts) in its own process. */
function startReference(): Promise<{ child: ChildProcess; port: number }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'bench/signal-reference.ts'], {
    cwd: repoRoot,
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    createInterface({ input: child.stdout! }).on('line', (line) => {
      const match = /^listening (\d+)$/.exec(line);
      if (match) resolve({ child, port: Number(match[1]) });
    });
    child.on('exit', (code) => reject(new Error(`the reference receiver exited with ${code}`)));
  });
}

/** Each panel sends its next frame as soon as the last is acknowledged, for `seconds`. */
async function closedLoop(port: number, accounts: string[], seconds: number) {
  const links = await Promise.all(accounts.map(() => openPanelLink(port)));
  let acknowledged = 0;
  let otherReplies = 0;
  const started = performance.now();
  const deadline = started + seconds * 1000;
  await Promise.all(
    links.map(async (link, index) => {
      for (let sequence = 1; performance.now() < deadline; sequence++) {
        const signal = everydaySignal(accounts[index]!, sequence);
        if (isAckFor(await link.send(simulatedFrame(signal)), signal)) acknowledged++;
        else otherReplies++;
      }
      link.close();
    }),
  );
  const elapsed = (performance.now() - started) / 1000;
  return { perSecond: acknowledged / elapsed, otherReplies };
}

/**
 * Frames offered at a fixed rate across the panels whatever the replies do, each latency
 * counted from when the frame was due: a sender that fell behind cannot hide the wait.
 */
async function openLoop(port: number, accounts: string[], perSecond: number, seconds: number) {
  const links = await Promise.all(accounts.map(() => openPanelLink(port)));
  const latencies: number[] = [];
  let otherReplies = 0;
  const answered: Promise<void>[] = [];
  const started = performance.now();
  const total = perSecond * seconds;
  for (let index = 0; index < total; index++) {
    const due = started + (index * 1000) / perSecond;
    const wait = due - performance.now();
    if (wait >= 1) await new Promise((resolve) => setTimeout(resolve, wait));
    const panel = index % links.length;
    const signal = everydaySignal(accounts[panel]!, 1 + Math.floor(index / links.length));
    answered.push(
      links[panel]!.send(simulatedFrame(signal)).then((reply) => {
        if (isAckFor(reply, signal)) latencies.push(performance.now() - due);
        else otherReplies++;
      }),
    );
  }
  await Promise.all(answered);
  // Below the offered rate when the receiver cannot keep up: then the latencies are queueing.
  const answeredPerSecond = latencies.length / ((performance.now() - started) / 1000);
  for (const link of links) link.close();
  latencies.sort((a, b) => a - b);
  return {
    p50: percentile(latencies, 0.5),
    p99: percentile(latencies, 0.99),
    answeredPerSecond,
    otherReplies,
  };
}

function warnIfRefused(label: string, otherReplies: number) {
  if (otherReplies > 0) console.log(`  (${label}: ${otherReplies} frames answered other than ACK)`);
}

async function benchThroughput(
  db: Knex,
  centre: BenchCentre,
  receiverPort: number,
  referencePort: number,
) {
  const ours: number[] = [];
  const yardstick: number[] = [];
  // Warm-up: the receiver's pool, PostgreSQL's plans and both processes' JIT.
  await closedLoop(receiverPort, await newAccounts(db, centre, PANELS), 1);
  await closedLoop(referencePort, await newAccounts(db, centre, PANELS), 1);
  for (let run = 0; run < RUNS; run++) {
    const real = await closedLoop(receiverPort, await newAccounts(db, centre, PANELS), SECONDS);
    warnIfRefused('receiver', real.otherReplies);
    ours.push(real.perSecond);
    const memory = await closedLoop(referencePort, await newAccounts(db, centre, PANELS), SECONDS);
    warnIfRefused('in-memory', memory.otherReplies);
    yardstick.push(memory.perSecond);
  }
  console.log(`sustained, ${PANELS} panels each sending on its ACK, ${SECONDS} s per run:`);
  console.log(
    `  receiver, ACK after commit: ${median(ours).toFixed(0)} signals/s (runs: ${list(ours)})`,
  );
  console.log(
    `  in-memory ACK, same framing: ${median(yardstick).toFixed(0)} signals/s (runs: ${list(yardstick)})`,
  );
  console.log(`  ratio receiver / in-memory: ${(median(ours) / median(yardstick)).toFixed(3)}`);
}

async function benchAckLatency(
  db: Knex,
  centre: BenchCentre,
  receiverPort: number,
  referencePort: number,
) {
  const measure = async (port: number) => {
    const p50: number[] = [];
    const p99: number[] = [];
    const rate: number[] = [];
    for (let run = 0; run < RUNS; run++) {
      const accounts = await newAccounts(db, centre, PANELS);
      const result = await openLoop(port, accounts, OFFERED_PER_SECOND, SECONDS);
      warnIfRefused(port === receiverPort ? 'receiver' : 'in-memory', result.otherReplies);
      p50.push(result.p50);
      p99.push(result.p99);
      rate.push(result.answeredPerSecond);
    }
    return `p50 ${ms(median(p50))}, p99 ${ms(median(p99))} (p99 runs: ${list(p99, 1)} ms), ACKs at ${median(rate).toFixed(0)}/s`;
  };
  console.log(
    `ACK latency at ${OFFERED_PER_SECOND} signals/s offered over ${PANELS} panels, ${SECONDS} s per run:`,
  );
  console.log(`  receiver, ACK after commit: ${await measure(receiverPort)}`);
  console.log(`  in-memory ACK:              ${await measure(referencePort)}`);
}

interface StreamChange {
  eventId: string | null;
  signalId?: string;
  at: number;
}

/** The operator's live stream, read as a browser's EventSource would; resolves once ready. */
function openOperatorStream(origin: string, cookie: string) {
  return new Promise<{ nextChange: () => Promise<StreamChange>; close: () => void }>(
    (resolve, reject) => {
      const arrived: StreamChange[] = [];
      const waiting: ((change: StreamChange) => void)[] = [];
      const request = get(
        `${origin}/api/monitoring/stream`,
        { headers: { cookie } },
        (response) => {
          if (response.statusCode !== 200) {
            reject(new Error(`the stream answered ${response.statusCode}`));
            return;
          }
          response.setEncoding('utf8');
          let text = '';
          response.on('data', (chunk: string) => {
            const at = performance.now();
            text += chunk;
            let end: number;
            while ((end = text.indexOf('\n\n')) !== -1) {
              const block = text.slice(0, end);
              text = text.slice(end + 2);
              const event = /^event: (.*)$/m.exec(block)?.[1];
              const data = /^data: (.*)$/m.exec(block)?.[1];
              if (event === 'ready') resolve({ nextChange, close: () => request.destroy() });
              if (event !== 'change' || !data) continue;
              const change = { ...(JSON.parse(data) as Omit<StreamChange, 'at'>), at };
              const waiter = waiting.shift();
              if (waiter) waiter(change);
              else arrived.push(change);
            }
          });
        },
      );
      request.on('error', reject);
      const nextChange = () =>
        new Promise<StreamChange>((resolveChange) => {
          const change = arrived.shift();
          if (change) resolveChange(change);
          else waiting.push(resolveChange);
        });
    },
  );
}

/** The API in this process with the operator signed in, as the browser's screen would use it. */
async function operatorApi(database: DatabaseConnection, operatorUserId: string) {
  const db = createDb(database, 10);
  const pool = new pg.Pool({ ...database, max: 2 });
  const secret = randomBytes(32).toString('base64url');
  const app = createApp({
    db,
    logger: createLogger('silent', 'bench'),
    oidc: createOidcClient({ issuer: 'http://127.0.0.1:9', clientId: 'x', clientSecret: 'x' }),
    sessionStore: createSessionStore(pool),
    sessionSecret: secret,
    appOrigins: ['http://127.0.0.1:3000'],
    mailer: createSmtpMailer({ host: '127.0.0.1', port: 9, from: 'bench@example.com' }),
    storage: createLocalDiskStorage(path.join(loadConfig().dataDir, 'bench-files')),
    idpIssuer: 'http://127.0.0.1:9',
    sealKeySecret: 'bench-only-secret-bench-only-secret-0000',
  });
  const server: Server = createServer(app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    origin: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    cookie: await sessionCookie(database, operatorUserId, secret),
    async close() {
      server.closeAllConnections();
      await new Promise((resolve) => server.close(resolve));
      await Promise.all([db.destroy(), pool.end()]);
    },
  };
}

/**
 * An intruder alarm from a new site each time, one at a time: a warm-up, then `RUNS` runs of
 * `perRun` sites, each timed by `timeOne`. Medians of each run's p50 and p99.
 */
async function oneAtATime(
  db: Knex,
  centre: BenchCentre,
  perRun: number,
  timeOne: (site: BenchSite) => Promise<number>,
) {
  for (const site of await monitoredSites(db, centre, 5)) await timeOne(site);
  const p50: number[] = [];
  const p99: number[] = [];
  for (let run = 0; run < RUNS; run++) {
    const latencies: number[] = [];
    for (const site of await monitoredSites(db, centre, perRun))
      latencies.push(await timeOne(site));
    latencies.sort((a, b) => a - b);
    p50.push(percentile(latencies, 0.5));
    p99.push(percentile(latencies, 0.99));
  }
  return `p50 ${ms(median(p50))}, p99 ${ms(median(p99))} (p99 runs: ${list(p99, 1)} ms)`;
}

async function acknowledged(link: PanelLink, account: string) {
  const reply = await link.send(intruderAlarm(account));
  if (!isAckFor(reply, { account, sequence: 1 }))
    throw new Error(`the receiver answered ${JSON.stringify(reply)}`);
}

/**
 * Timed from the frame leaving the panel until the operator's stream delivers the change. The
 * stream names the signal it is about; that it was this site's is checked after timing.
 */
async function benchSignalToScreen(
  db: Knex,
  database: DatabaseConnection,
  centre: BenchCentre,
  receiverPort: number,
) {
  const api = await operatorApi(database, centre.operatorUserId);
  const stream = await openOperatorStream(api.origin, api.cookie);
  const link = await openPanelLink(receiverPort);
  const seen: { signalId: string | undefined; account: string }[] = [];
  let figures: string;
  try {
    figures = await oneAtATime(db, centre, SCREEN_SIGNALS, async ({ account }) => {
      const change = stream.nextChange();
      const sentAt = performance.now();
      const [delivered] = await Promise.all([change, acknowledged(link, account)]);
      seen.push({ signalId: delivered.signalId, account });
      return delivered.at - sentAt;
    });
  } finally {
    link.close();
    stream.close();
    await api.close();
  }
  const stored: { id: number; account: string }[] = await db('signals')
    .whereIn(
      'id',
      seen.map((entry) => entry.signalId ?? '0'),
    )
    .select('id', 'account');
  const accountOf = new Map(stored.map((row) => [String(row.id), row.account]));
  const mismatched = seen.filter((entry) => accountOf.get(entry.signalId ?? '') !== entry.account);
  console.log(
    `signal to operator screen (frame sent → SSE "change" on GET /api/monitoring/stream), ${SCREEN_SIGNALS} intruder alarms per run, one at a time:`,
  );
  console.log(
    `  ${figures}${mismatched.length ? ` — ${mismatched.length} changes were not for the signal sent` : ''}`,
  );
}

/** How long the first text may take before the bench decides none is coming. */
const FIRST_TEXT_WAIT_MS = 15_000;

/**
 * Timed from the frame leaving the panel until the local Twilio fake holds the text to the
 * site's first keyholder. The centre messages keyholders without waiting for an operator, so
 * the path is: receiver commits the event and queues the text (the outbox) → NOTIFY → the
 * call-out engine, as the API process runs it → the twilio SDK → the fake.
 */
async function benchSignalToSms(
  db: Knex,
  database: DatabaseConnection,
  centre: BenchCentre,
  receiverPort: number,
) {
  const label = `signal to keyholder SMS (frame sent → text at the local Twilio fake), ${SMS_SIGNALS} intruder alarms per run, one at a time:`;
  await db('organisations').where({ id: centre.centreId }).update({ callout_automatic: true });
  const authToken = randomBytes(16).toString('hex');
  const fake = createTwilioFake({
    accountSid: LOCAL_TWILIO_ACCOUNT_SID,
    authToken,
    phoneNumber: LOCAL_TWILIO_FROM,
    statusStepMs: 10,
  });
  const fakeServer = createServer(fake.app);
  await new Promise<void>((resolve) => fakeServer.listen(0, '127.0.0.1', resolve));
  const engineDb = createDb(database, 4);
  const engine = await startCallOutEngine({
    db: engineDb,
    logger: createLogger('silent', 'bench'),
    sms: createSmsSender({
      accountSid: LOCAL_TWILIO_ACCOUNT_SID,
      authToken,
      from: LOCAL_TWILIO_FROM,
      apiBaseUrl: `http://127.0.0.1:${(fakeServer.address() as AddressInfo).port}`,
    }),
    // Port 9 (discard): delivery reports come after the text and are not part of this figure.
    statusCallbackUrl: 'http://127.0.0.1:9/api/webhooks/twilio/status',
    connection: database,
  });
  const link = await openPanelLink(receiverPort);
  let waitMs = FIRST_TEXT_WAIT_MS;
  try {
    const figures = await oneAtATime(db, centre, SMS_SIGNALS, async (site) => {
      const text = fake.inbox
        .waitFor(
          (message) =>
            message.direction === 'outbound' &&
            message.to === site.keyholderPhone &&
            message.body.includes(`at ${site.name},`),
          waitMs,
        )
        .then(() => performance.now());
      const sentAt = performance.now();
      await acknowledged(link, site.account);
      const arrivedAt = await text;
      waitMs = 10_000;
      return arrivedAt - sentAt;
    });
    console.log(label);
    console.log(`  ${figures}`);
  } catch (error) {
    if (waitMs !== FIRST_TEXT_WAIT_MS) throw error;
    // TODO: measure once the receiver starts a centre's automatic call-out for an intruder alarm
    // (server/monitoring/callout/service.ts startAutomaticCallOut, not yet called on a signal).
    console.log(label);
    console.log('  not measured: no text reached the fake, so the receiver starts no call-out yet');
  } finally {
    link.close();
    fake.close();
    await engine.stop();
    fakeServer.closeAllConnections();
    await new Promise((resolve) => fakeServer.close(resolve));
    await engineDb.destroy();
  }
}

export async function benchSignals(): Promise<void> {
  const { database, finish } = await benchDatabase('signals');
  const db = createDb(database, 4);
  const stops: (() => Promise<unknown> | void)[] = [];
  try {
    await migrateToLatest(db);
    const centre = await seedCentre(db);
    console.log(`\nAlarm signals: SIA DC-09 over loopback TCP, ${RUNS} runs each, medians`);
    const receiverPort = await freePort();
    const receiver = await startReceiverProcess({ database, port: receiverPort });
    stops.push(() => stopProcess(receiver));
    const reference = await startReference();
    stops.push(() => void reference.child.kill('SIGTERM'));

    await benchThroughput(db, centre, receiverPort, reference.port);
    await benchAckLatency(db, centre, receiverPort, reference.port);
    await benchSignalToScreen(db, database, centre, receiverPort);
    await benchSignalToSms(db, database, centre, receiverPort);
  } finally {
    for (const stop of stops.reverse()) await stop();
    await db.destroy();
    await finish();
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  await benchSignals();
  process.exit(0);
}
