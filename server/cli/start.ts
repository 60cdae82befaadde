import { loadConfig, ConfigError } from '../config/config';
import { loadOrCreateSecrets } from '../config/secrets';
import { PostgresSetupError, type RunningPostgres } from '../db/postgres-server';
import { prepareDatabase } from './prepare-database';
import { startProcess, stopProcess, waitForHttp, type ManagedProcess } from './processes';

/**
 * `npm start` and `npm run dev`: PostgreSQL, migrations and the demo seed, then the mail
 * catcher, the Twilio fake, the identity provider and the API (or Vite's dev server in front of
 * it) as child processes. Ctrl-C stops all of them, PostgreSQL included.
 */
const dev = process.argv.includes('--dev');
const log = (message: string) => console.log(`[start]  ${message}`);

const children: ManagedProcess[] = [];
let postgres: RunningPostgres | undefined;
let stopping = false;

async function stopAll(exitCode: number) {
  if (stopping) return;
  stopping = true;
  log('stopping…');
  await Promise.all([...children].reverse().map((child) => stopProcess(child)));
  if (postgres?.startedHere) await postgres.stop();
  process.exit(exitCode);
}

process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));

try {
  const config = loadConfig();
  loadOrCreateSecrets(config.dataDir);
  postgres = await prepareDatabase(config, { seed: true, log });

  const env = { NODE_ENV: dev ? 'development' : 'production' };
  const launch = (name: string, entry: string) => {
    const child = startProcess(name, entry, env);
    children.push(child);
    void child.exited.then((code) => {
      if (!stopping) {
        log(`${name} exited unexpectedly (code ${code}); stopping everything`);
        void stopAll(1);
      }
    });
    return child;
  };

  launch('mail', 'server/fakes/smtp/index.ts');
  launch('sms', 'server/fakes/twilio/index.ts');
  launch('idp', 'idp/index.ts');
  launch('api', 'server/index.ts');
  launch('receiver', 'server/monitoring/receiver-main.ts');
  if (dev) {
    const vite = startProcess('vite', 'node_modules/vite/bin/vite.js', {});
    children.push(vite);
  }

  await Promise.all([
    waitForHttp(`http://127.0.0.1:${config.mail.viewerPort}/api/messages`),
    waitForHttp(`${config.twilio.apiBaseUrl}/api/messages`),
    waitForHttp(`${config.idp.issuer}/.well-known/openid-configuration`),
    waitForHttp(`http://127.0.0.1:${config.api.port}/api/health`),
    ...(dev ? [waitForHttp(config.devServerUrl)] : []),
  ]);

  const appUrl = dev ? config.devServerUrl : config.api.publicUrl;
  console.log(`
  Wardbook is running.

    App                 ${appUrl}
    Sign-in service     ${config.idp.issuer}
    Local e-mail        http://127.0.0.1:${config.mail.viewerPort}
    Local SMS           ${config.twilio.apiBaseUrl}
    Alarm receiver      127.0.0.1:${config.monitoring.receiverPort} (SIA DC-09; npm run simulate)
    PostgreSQL          127.0.0.1:${config.postgres.port}, database "${config.postgres.database}"

  Demo accounts (password and one-time-code secrets): README.md, "Demo accounts".
  Press Ctrl-C to stop everything.
`);
} catch (error) {
  if (error instanceof ConfigError || error instanceof PostgresSetupError) {
    console.error(`\n${error.message}\n`);
  } else {
    console.error(error);
  }
  await stopAll(1);
}
