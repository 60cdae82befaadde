import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes, randomUUID } from 'node:crypto';
import { createInterface } from 'node:readline';
import path from 'node:path';
import signature from 'cookie-signature';
import pg from 'pg';
import request from 'supertest';
import { createApp } from '../server/app';
import { createOidcClient } from '../server/auth/oidc-client';
import { createSessionStore, SESSION_COOKIE } from '../server/auth/session';
import { loadConfig } from '../server/config/config';
import { createDb } from '../server/db/knex';
import { migrateToLatest } from '../server/db/migrate';
import { createLocalDiskStorage } from '../server/files/storage';
import { createLogger } from '../server/http/logger';
import { createSmtpMailer } from '../server/mail/mailer';
import { repoRoot } from '../server/paths';
import { benchCalculations } from './calculations';
import { benchDatabase } from './lib/database';
import { load, median, type LoadResult } from './lib/load';

/**
 * Issue 3's benchmark: 5,000 sites and 80,000 zones (product.md's scale for one company),
 * then the sites list page and the site workspace under 50 concurrent connections, each
 * against a bare Express handler in the same run; and SQL statements per request.
 */
const SITES = Number(process.env.BENCH_SITES ?? 5000);
const ZONES_PER_SITE = 16;
const CONNECTIONS = 50;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const RUNS = Number(process.env.BENCH_RUNS ?? 3);

export async function seedBenchData(database: {
  host: string;
  port: number;
  user: string;
  database: string;
}) {
  const db = createDb(database, 4);
  await migrateToLatest(db);
  const [installer] = await db('organisations')
    .insert({ kind: 'installer', name: 'Bench Installer' })
    .returning('id');
  const [centre] = await db('organisations')
    .insert({ kind: 'monitoring_centre', name: 'Bench Centre' })
    .returning('id');
  const [user] = await db('users')
    .insert({
      idp_subject: randomUUID(),
      email: 'bench.office@example.com',
      display_name: 'Bench Office',
    })
    .returning('id');
  await db('memberships').insert({
    user_id: user.id,
    role: 'office',
    organisation_id: installer.id,
  });
  await db.raw(
    `insert into sites (installer_id, reference, name, premises_type, address_line1, town, postcode,
                        required_grade, environmental_class, monitoring_centre_id, monitoring_account)
     select :installer, 'S-' || lpad(g::text, 5, '0'), 'Bench site ' || g,
            case when g % 4 = 0 then 'commercial' else 'domestic' end,
            g || ' Bench Road', (array['Eastmere', 'Fernmoor', 'Little Haldon'])[1 + g % 3],
            'EM' || (1 + g % 9) || ' ' || (1 + g % 9) || 'AB', 2 + g % 2, 2,
            case when g % 2 = 0 then :centre::uuid end,
            case when g % 2 = 0 then upper(to_hex(4096 + g)) end
       from generate_series(1, :sites) g`,
    { installer: installer.id, centre: centre.id, sites: SITES },
  );
  await db.raw(
    `insert into systems (site_id, control_panel, psu_type, battery_ah, panel_grade, panel_quiescent_ma, panel_alarm_ma, mains_failure_signalled)
     select id, 'Bench panel', 'A', case when required_grade = 2 then 7 else 17 end, required_grade, 120, 200, monitoring_centre_id is not null
       from sites`,
  );
  await db.raw(
    `insert into devices (system_id, position, kind, location, quiescent_ma, alarm_ma)
     select sy.id, d.position, d.kind, d.location, d.quiescent, d.alarm
       from systems sy,
            (values (1, 'keypad', 'Hall', 40, 60), (2, 'external_sounder', 'Front elevation', 25, 450)) as d(position, kind, location, quiescent, alarm)`,
  );
  await db.raw(
    `insert into zones (system_id, position, number, location, zone_type, detector_kind, loop_wiring, tamper_ohms, alarm_ohms, quiescent_ma, alarm_ma)
     select sy.id, z, z, 'Room ' || z, 'instant', 'pir', 'two_resistor', 2200, 4700, 15, 25
       from systems sy, generate_series(1, :zones) z`,
    { zones: ZONES_PER_SITE },
  );
  await db.raw(
    `insert into keyholders (site_id, call_order, name, phone, minutes_to_attend)
     select s.id, k, 'Keyholder ' || k, '+4477009001' || lpad(k::text, 2, '0'), 10 from sites s, generate_series(1, 2) k`,
  );
  await db.raw(
    `insert into site_engineers (site_id, user_id) select id, :user from sites where random() < 0.3`,
    {
      user: user.id,
    },
  );
  await db.raw('analyze');
  const counts = await db.raw(
    `select (select count(*) from sites) sites, (select count(*) from zones) zones`,
  );
  const middle = await db('sites')
    .orderBy('reference')
    .offset(Math.floor(SITES / 2))
    .first('id');
  await db.destroy();
  return { userId: user.id as string, siteId: middle.id as string, counts: counts.rows[0] };
}

export async function sessionCookie(database: object, userId: string, secret: string) {
  const pool = new pg.Pool({ ...database, max: 1 });
  const sid = randomBytes(24).toString('base64url');
  const expires = new Date(Date.now() + 3_600_000);
  await pool.query('insert into sessions (sid, sess, expire) values ($1, $2, $3)', [
    sid,
    { cookie: { originalMaxAge: 3_600_000, expires, httpOnly: true, path: '/' }, userId },
    expires,
  ]);
  await pool.end();
  return `${SESSION_COOKIE}=${encodeURIComponent(`s:${signature.sign(sid, secret)}`)}`;
}

function serve(
  mode: 'wardbook' | 'bare',
  env: NodeJS.ProcessEnv,
): Promise<{ child: ChildProcess; origin: string }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'bench/serve.ts', mode], {
    cwd: repoRoot,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    createInterface({ input: child.stdout! }).on('line', (line) => {
      const match = line.match(/^listening (\d+)$/);
      if (match) resolve({ child, origin: `http://127.0.0.1:${match[1]}` });
    });
    child.on('exit', (code) => reject(new Error(`bench server (${mode}) exited with ${code}`)));
  });
}

async function measure(url: string, headers: Record<string, string>) {
  await load({ url, connections: CONNECTIONS, seconds: 1, headers }); // warm-up
  const runs: LoadResult[] = [];
  for (let run = 0; run < RUNS; run++)
    runs.push(await load({ url, connections: CONNECTIONS, seconds: SECONDS, headers }));
  if (runs.some((r) => r.errors > 0)) throw new Error(`non-200 answers while loading ${url}`);
  return {
    rps: median(runs.map((r) => r.requestsPerSecond)),
    p95: median(runs.map((r) => r.p95Ms)),
  };
}

/** Counts the SQL statements one request makes: Knex's and the session store's. */
async function statementsPerRequest(
  database: object,
  cookie: string,
  secret: string,
  paths: string[],
) {
  const db = createDb(database as never, 4);
  let knexQueries = 0;
  db.on('query', () => knexQueries++);
  const pool = new pg.Pool({ ...database, max: 2 });
  let sessionQueries = 0;
  const query = pool.query.bind(pool);
  pool.query = ((...args: Parameters<typeof query>) => {
    sessionQueries++;
    return query(...args);
  }) as typeof pool.query;
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
  const counts: Record<string, { knex: number; session: number }> = {};
  for (const url of paths) {
    await request(app).get(url).set('Cookie', cookie); // warm caches (discovery, prepared pools)
    knexQueries = 0;
    sessionQueries = 0;
    const response = await request(app).get(url).set('Cookie', cookie);
    if (response.status !== 200) throw new Error(`${url} answered ${response.status}`);
    counts[url] = { knex: knexQueries, session: sessionQueries };
  }
  await db.destroy();
  await pool.end();
  return counts;
}

export async function benchRecords() {
  const { database, finish } = await benchDatabase('records');
  const children: ChildProcess[] = [];
  try {
    const started = performance.now();
    const { userId, siteId, counts } = await seedBenchData(database);
    console.log(
      `\nAs-fitted record: ${counts.sites} sites, ${counts.zones} zones seeded in ${((performance.now() - started) / 1000).toFixed(1)} s`,
    );
    const secret = randomBytes(32).toString('base64url');
    const cookie = await sessionCookie(database, userId, secret);
    const env = { BENCH_DATABASE: database.database, BENCH_SESSION_SECRET: secret };
    const wardbook = await serve('wardbook', env);
    const bare = await serve('bare', env);
    children.push(wardbook.child, bare.child);

    const headers = { cookie };
    const endpoints = [
      ['sites list page (25 rows, by name)', '/api/sites?page=1&pageSize=25&sort=name&order=asc'],
      ['sites list, search "site 42"', '/api/sites?q=site%2042&pageSize=25'],
      ['site workspace (GET /api/sites/:id)', `/api/sites/${siteId}`],
      ['zone schedule (GET /api/sites/:id/zones)', `/api/sites/${siteId}/zones`],
    ] as const;
    const baseline = await measure(`${bare.origin}/api/sites`, headers);
    console.log(`under ${CONNECTIONS} connections, ${RUNS} runs of ${SECONDS} s, medians:`);
    console.log(
      `  bare Express handler: ${baseline.rps.toFixed(0)} req/s, p95 ${baseline.p95.toFixed(1)} ms`,
    );
    for (const [label, url] of endpoints) {
      const result = await measure(`${wardbook.origin}${url}`, headers);
      console.log(
        `  ${label}: ${result.rps.toFixed(0)} req/s (ratio ${(result.rps / baseline.rps).toFixed(2)}), p95 ${result.p95.toFixed(1)} ms (ratio ${(result.p95 / baseline.p95).toFixed(1)})`,
      );
    }

    const statements = await statementsPerRequest(database, cookie, secret, [
      '/api/sites?page=1&pageSize=25',
      '/api/sites?page=1&pageSize=100',
      `/api/sites/${siteId}`,
      `/api/sites/${siteId}/zones`,
    ]);
    console.log('SQL statements per request (Knex + session store):');
    for (const [url, count] of Object.entries(statements)) {
      console.log(`  ${url.replace(siteId, ':id')}: ${count.knex} + ${count.session}`);
    }
    await benchCalculations(database);
  } finally {
    for (const child of children) child.kill('SIGTERM');
    await finish();
  }
}
