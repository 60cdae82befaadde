import { spawn } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import autocannon from 'autocannon';
import express from 'express';
import pg from 'pg';
import { build } from 'vite';
import { createApp } from '../server/app';
import { createOidcClient } from '../server/auth/oidc-client';
import { createSessionStore } from '../server/auth/session';
import { loadConfig } from '../server/config/config';
import { createDb } from '../server/db/knex';
import { migrateToLatest } from '../server/db/migrate';
import { dropDatabase, ensureDatabase, startPostgres } from '../server/db/postgres-server';
import { createLocalDiskStorage } from '../server/files/storage';
import { createLogger } from '../server/http/logger';
import { createSmtpMailer } from '../server/mail/mailer';
import { repoRoot } from '../server/paths';
import { benchPack } from './pack';
import { benchRecords } from './records';
import { benchOperatorScreen } from './operator-screen';
import { benchSignals } from './signals';

/**
 * `npm run bench`: prints figures, never passes or fails on them.
 *   1. cold start to ready: `server/cli/start.ts` on a brand-new data folder (initdb,
 *      migrations, seed, IdP, API, mail catcher) until it reports ready; median of 3.
 *   2. requests per second for GET /api/health against a bare Express handler, same run,
 *      same machine, as a ratio.
 *   3. the client's initial JavaScript, gzipped.
 *   4. the as-fitted record at one company's scale (bench/records.ts).
 *   5. the handover pack PDF for a 40-zone site (bench/pack.ts).
 *   6. alarm signals: receiver throughput and latency, signal to operator screen (bench/signals.ts).
 *   7. a signal drawn in the operator's browser, Chromium included (bench/operator-screen.ts).
 */
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
};

async function coldStartSeconds(run: number): Promise<number> {
  const dataDir = path.join('.data', `bench-cold-${process.pid}-${run}`);
  const base = 45000 + run * 10;
  const env = {
    ...process.env,
    WARDBOOK_DATA_DIR: dataDir,
    WARDBOOK_PG_PORT: String(base),
    WARDBOOK_API_PORT: String(base + 1),
    WARDBOOK_IDP_PORT: String(base + 2),
    WARDBOOK_SMTP_PORT: String(base + 3),
    WARDBOOK_MAIL_VIEWER_PORT: String(base + 4),
    WARDBOOK_TWILIO_PORT: String(base + 5),
    WARDBOOK_RECEIVER_PORT: String(base + 6),
  };
  const started = performance.now();
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/cli/start.ts'], {
    cwd: repoRoot,
    env,
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const seconds = await new Promise<number>((resolve, reject) => {
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('Wardbook is running.')) resolve((performance.now() - started) / 1000);
    });
    child.on('exit', (code) =>
      reject(new Error(`start exited with ${code} before ready:\n${output}`)),
    );
  });
  child.kill('SIGINT');
  await new Promise((resolve) => child.once('exit', resolve));
  rmSync(path.join(repoRoot, dataDir), { recursive: true, force: true });
  return seconds;
}

async function listen(handler: express.Express): Promise<{ server: Server; url: string }> {
  const server = createServer(handler);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

async function requestsPerSecond(url: string): Promise<number> {
  const result = await autocannon({ url, connections: 20, duration: 5, pipelining: 1 });
  if (result.non2xx > 0 || result.errors > 0) throw new Error(`errors while loading ${url}`);
  return result.requests.average;
}

async function healthThroughput() {
  const config = loadConfig();
  const postgres = await startPostgres({
    dataDir: path.join(config.dataDir, 'postgres'),
    port: config.postgres.port,
  });
  const database = `wardbook_bench_${process.pid}`;
  await ensureDatabase(postgres, database);
  const connection = { ...config.postgres, database };
  const db = createDb(connection);
  const pool = new pg.Pool({ ...connection, max: 2 });
  await migrateToLatest(db);

  const wardbook = await listen(
    createApp({
      db,
      logger: createLogger('silent', 'bench'),
      oidc: createOidcClient({ issuer: 'http://127.0.0.1:9', clientId: 'x', clientSecret: 'x' }),
      sessionStore: createSessionStore(pool),
      sessionSecret: 'bench-only-secret-bench-only-secret',
      appOrigins: ['http://127.0.0.1:3000'],
      mailer: createSmtpMailer({ host: '127.0.0.1', port: 9, from: 'bench@example.com' }),
      storage: createLocalDiskStorage(path.join(config.dataDir, 'bench-files')),
      idpIssuer: 'http://127.0.0.1:9',
      sealKeySecret: 'bench-only-secret-bench-only-secret-0000',
    }),
  );
  const bare = express();
  bare.get('/api/health', (_req, res) => {
    res.json({ status: 'ok' });
  });
  const bareServer = await listen(bare);

  const ours: number[] = [];
  const baseline: number[] = [];
  await requestsPerSecond(`${wardbook.url}/api/health`); // warm-up
  for (let run = 0; run < RUNS; run++) {
    ours.push(await requestsPerSecond(`${wardbook.url}/api/health`));
    baseline.push(await requestsPerSecond(`${bareServer.url}/api/health`));
  }
  wardbook.server.close();
  bareServer.server.close();
  await Promise.all([db.destroy(), pool.end()]);
  await dropDatabase(postgres, database);
  await postgres.stop();
  return { ours: median(ours), baseline: median(baseline) };
}

async function initialJavaScriptGzipped() {
  const outDir = path.join(loadConfig().dataDir, 'bench-client');
  await build({ root: repoRoot, logLevel: 'silent', build: { outDir, emptyOutDir: true } });
  const index = readFileSync(path.join(outDir, 'index.html'), 'utf8');
  const files = [
    ...index.matchAll(/<(?:script[^>]+src|link[^>]+rel="modulepreload"[^>]+href)="([^"]+\.js)"/g),
  ].map((match) => match[1]!);
  let raw = 0;
  let gzipped = 0;
  for (const file of files) {
    const bytes = readFileSync(path.join(outDir, file));
    raw += bytes.length;
    gzipped += gzipSync(bytes, { level: 9 }).length;
  }
  rmSync(outDir, { recursive: true, force: true });
  return { files: files.length, raw, gzipped };
}

const kib = (bytes: number) => `${(bytes / 1024).toFixed(1)} KiB`;

// `npm run bench -- records` runs only the as-fitted record benchmark; `-- pack` only the
// handover pack PDF; `-- signals` only the alarm signals; `-- operator-screen` only the
// signal-to-browser latency.
const only = process.argv[2];
if (only === 'records') {
  await benchRecords();
  process.exit(0);
}
if (only === 'pack') {
  await benchPack();
  process.exit(0);
}
if (only === 'signals') {
  await benchSignals();
  process.exit(0);
}
if (only === 'operator-screen') {
  await benchOperatorScreen();
  process.exit(0);
}

console.log(`Wardbook benchmarks (${RUNS} runs each, medians)\n`);

const starts: number[] = [];
for (let run = 0; run < RUNS; run++) starts.push(await coldStartSeconds(run));
console.log(
  `cold start to ready (new data folder, initdb included): ${median(starts).toFixed(2)} s`,
);
console.log(`  runs: ${starts.map((s) => s.toFixed(2)).join(', ')} s`);

const health = await healthThroughput();
console.log(`GET /api/health (database round trip): ${health.ours.toFixed(0)} req/s`);
console.log(`bare Express handler, same run:        ${health.baseline.toFixed(0)} req/s`);
console.log(`ratio Wardbook / bare:                 ${(health.ours / health.baseline).toFixed(2)}`);

const js = await initialJavaScriptGzipped();
console.log(
  `client initial JavaScript: ${kib(js.gzipped)} gzipped (${kib(js.raw)} raw, ${js.files} file(s))`,
);

await benchRecords();

await benchPack();

await benchSignals();

if (existsSync(path.join(repoRoot, '.data', 'bench-client')))
  rmSync(path.join(repoRoot, '.data', 'bench-client'), { recursive: true });

await benchOperatorScreen();
