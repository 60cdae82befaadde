import { execFile, spawn } from 'node:child_process';
import {
  readFileSync,
  existsSync,
  mkdirSync,
  readdirSync,
  statSync,
  chmodSync,
  chownSync,
} from 'node:fs';
import { writeFile } from 'node:fs/promises';
import { createServer as createNetServer, type AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import pg from 'pg';

const run = promisify(execFile);

export interface PostgresServerOptions {
  /** Folder holding the cluster; created and initialised on first use. */
  dataDir: string;
  port: number;
  /** Tests may run beside another checkout's server: then any free port will do. */
  anyFreePort?: boolean;
  log?: (message: string) => void;
}

export interface RunningPostgres {
  host: string;
  port: number;
  user: string;
  /** False when a server was already running on this data folder; stop() then leaves it up. */
  startedHere: boolean;
  stop(): Promise<void>;
}

export class PostgresSetupError extends Error {}

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;
const SUPERUSER = 'postgres';

/**
 * Starts (or reuses) the project's own PostgreSQL cluster on loopback, using Debian's server
 * binaries. Idempotent: initialises once, reuses a server already running on the folder.
 */
export async function startPostgres(options: PostgresServerOptions): Promise<RunningPostgres> {
  const log = options.log ?? (() => {});
  const bin = await findPostgresBinaries(log);
  const dataDir = path.resolve(options.dataDir);
  const osUser = isRoot() ? await postgresOsUser() : undefined;

  prepareDataFolder(dataDir, osUser, log);
  if (!existsSync(path.join(dataDir, 'PG_VERSION'))) {
    log(`initialising a PostgreSQL cluster in ${dataDir}`);
    // Trust authentication is acceptable only because the server listens on 127.0.0.1 alone.
    await asPostgres(osUser, path.join(bin, 'initdb'), [
      '-D',
      dataDir,
      '-U',
      SUPERUSER,
      '-A',
      'trust',
      '-E',
      'UTF8',
      '--locale=C.UTF-8',
    ]);
    await writeFile(
      path.join(dataDir, 'postgresql.auto.conf'),
      [
        "listen_addresses = '127.0.0.1'",
        // No unix socket: deep checkout paths overflow the socket path limit, and TCP on
        // loopback is all Wardbook uses.
        "unix_socket_directories = ''",
        'fsync = on',
        'max_connections = 200',
        '',
      ].join('\n'),
    );
    if (osUser) chownSync(path.join(dataDir, 'postgresql.auto.conf'), osUser.uid, osUser.gid);
  }

  const runningPort = (await isRunningOn(bin, dataDir, osUser))
    ? portOfRunningServer(dataDir)
    : undefined;
  if (runningPort !== undefined) {
    if (runningPort === options.port || options.anyFreePort) {
      log(`PostgreSQL already running on 127.0.0.1:${runningPort}; reusing it`);
      return handle(runningPort, false, async () => {});
    }
    throw new PostgresSetupError(
      `This data folder's PostgreSQL is already running on port ${runningPort}. ` +
        `Stop it, or set WARDBOOK_PG_PORT=${runningPort}.`,
    );
  }

  let port = options.port;
  if (await isAccepting(port)) {
    if (!options.anyFreePort) {
      throw new PostgresSetupError(
        `Port ${port} on 127.0.0.1 is taken by another server. Stop it or set WARDBOOK_PG_PORT.`,
      );
    }
    port = await freePort();
    log(`port ${options.port} is taken by another server; using ${port}`);
  }

  const logFile = path.join(dataDir, 'server.log');
  log(`starting PostgreSQL on 127.0.0.1:${port}`);
  try {
    await asPostgres(osUser, path.join(bin, 'pg_ctl'), [
      '-D',
      dataDir,
      '-l',
      logFile,
      '-o',
      `-p ${port} -c listen_addresses=127.0.0.1`,
      '-w',
      '-t',
      '60',
      'start',
    ]);
  } catch (error) {
    throw new PostgresSetupError(
      `PostgreSQL did not start; see ${logFile}.\n${(error as Error).message}`,
    );
  }
  return handle(port, true, async () => {
    log('stopping PostgreSQL');
    await asPostgres(osUser, path.join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
  });
}

/** Stops the server running on a data folder, whoever started it. */
export async function stopPostgresServer(dataDir: string): Promise<void> {
  const bin = locateBinaries();
  if (!bin) return;
  const osUser = isRoot() ? await postgresOsUser() : undefined;
  const folder = path.resolve(dataDir);
  if (!(await isRunningOn(bin, folder, osUser))) return;
  await asPostgres(osUser, path.join(bin, 'pg_ctl'), ['-D', folder, '-m', 'fast', '-w', 'stop']);
}

function handle(port: number, startedHere: boolean, stop: () => Promise<void>): RunningPostgres {
  let stopped: Promise<void> | undefined;
  return {
    host: '127.0.0.1',
    port,
    user: SUPERUSER,
    startedHere,
    stop: () => (stopped ??= stop()),
  };
}

async function findPostgresBinaries(log: (message: string) => void): Promise<string> {
  const found = locateBinaries();
  if (found) return found;
  if (!isRoot() || !existsSync('/usr/bin/apt-get')) {
    throw new PostgresSetupError(
      'PostgreSQL server binaries were not found. Install Debian\'s "postgresql" package ' +
        '(sudo apt-get install -y postgresql) and run again.',
    );
  }
  log('PostgreSQL is not installed; installing Debian\'s "postgresql" package (one time)');
  // Debian would otherwise create and start a system-wide cluster on port 5432.
  mkdirSync('/etc/postgresql-common', { recursive: true });
  const createClusterConf = '/etc/postgresql-common/createcluster.conf';
  if (!existsSync(createClusterConf)) {
    await writeFile(createClusterConf, 'create_main_cluster = false\n');
  }
  const aptEnv = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  await run('apt-get', ['update', '-qq'], { env: aptEnv, maxBuffer: 1 << 26 });
  await run('apt-get', ['install', '-y', '-qq', 'postgresql'], { env: aptEnv, maxBuffer: 1 << 26 });
  const installed = locateBinaries();
  if (!installed)
    throw new PostgresSetupError('Installed "postgresql" but found no server binaries.');
  return installed;
}

function locateBinaries(): string | undefined {
  const root = '/usr/lib/postgresql';
  if (!existsSync(root)) return undefined;
  const versions = readdirSync(root)
    .filter((name) => /^\d+$/.test(name) && existsSync(path.join(root, name, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions[0] ? path.join(root, versions[0], 'bin') : undefined;
}

interface OsUser {
  uid: number;
  gid: number;
}

async function postgresOsUser(): Promise<OsUser> {
  try {
    const uid = Number((await run('id', ['-u', SUPERUSER])).stdout.trim());
    const gid = Number((await run('id', ['-g', SUPERUSER])).stdout.trim());
    return { uid, gid };
  } catch {
    throw new PostgresSetupError(
      'Running as root, but there is no "postgres" OS user to run the server as. ' +
        'Install Debian\'s "postgresql" package, which creates it.',
    );
  }
}

function prepareDataFolder(dataDir: string, osUser: OsUser | undefined, log: (m: string) => void) {
  mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  if (!osUser) return;
  chownSync(dataDir, osUser.uid, osUser.gid);
  chmodSync(dataDir, 0o700);
  // The server runs as "postgres" and must be able to walk down to its folder. A scratch
  // clone made by root under a 0700 folder would stop it, so grant traverse (x) only.
  for (let dir = path.dirname(dataDir); dir !== path.dirname(dir); dir = path.dirname(dir)) {
    const mode = statSync(dir).mode;
    if ((mode & 0o001) === 0) {
      log(`granting traverse permission on ${dir} so the postgres user can reach its data`);
      chmodSync(dir, (mode & 0o7777) | 0o001);
    }
  }
}

async function asPostgres(osUser: OsUser | undefined, command: string, args: string[]) {
  // Through spawn with uid/gid rather than `su`, so no shell quoting is involved.
  await new Promise<void>((resolve, reject) => {
    const child = spawn(command, args, {
      uid: osUser?.uid,
      gid: osUser?.gid,
      cwd: os.tmpdir(),
      stdio: ['ignore', 'pipe', 'pipe'],
      env: { ...process.env, LC_ALL: 'C.UTF-8' },
    });
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.on('error', reject);
    child.on('close', (code) =>
      code === 0
        ? resolve()
        : reject(new Error(`${path.basename(command)} exited with ${code}: ${output.trim()}`)),
    );
  });
}

async function isRunningOn(bin: string, dataDir: string, osUser: OsUser | undefined) {
  try {
    await asPostgres(osUser, path.join(bin, 'pg_ctl'), ['-D', dataDir, 'status']);
    return true;
  } catch {
    return false;
  }
}

/** postmaster.pid's fourth line is the port the running server listens on. */
function portOfRunningServer(dataDir: string): number | undefined {
  try {
    const port = Number(readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n')[3]);
    return Number.isInteger(port) && port > 0 ? port : undefined;
  } catch {
    return undefined;
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createNetServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}

async function isAccepting(port: number): Promise<boolean> {
  const client = new pg.Client({
    host: '127.0.0.1',
    port,
    user: SUPERUSER,
    database: 'postgres',
    connectionTimeoutMillis: 1000,
  });
  try {
    await client.connect();
    return true;
  } catch {
    return false;
  } finally {
    await client.end().catch(() => {});
  }
}

/** Creates the database if it does not exist yet. */
export async function ensureDatabase(server: RunningPostgres, database: string): Promise<void> {
  const client = adminClient(server);
  await client.connect();
  try {
    const { rowCount } = await client.query('select 1 from pg_database where datname = $1', [
      database,
    ]);
    if (!rowCount) await client.query(`create database ${pg.escapeIdentifier(database)}`);
  } finally {
    await client.end();
  }
}

export async function dropDatabase(server: RunningPostgres, database: string): Promise<void> {
  const client = adminClient(server);
  await client.connect();
  try {
    await client.query(`drop database if exists ${pg.escapeIdentifier(database)} with (force)`);
  } finally {
    await client.end();
  }
}

function adminClient(server: RunningPostgres) {
  return new pg.Client({
    host: server.host,
    port: server.port,
    user: server.user,
    database: 'postgres',
  });
}
