import type { Server } from 'node:https';
import { loadConfig } from '../config/config';
import { createDb } from '../db/knex';
import { createLogger } from '../http/logger';
import { createIntakeApp } from './intake/app';
import { createIntakeServer } from './intake/server';
import { loadOrCreateIntakeTls } from './intake/tls';
import { startMissedTestSweep } from './missed-tests';
import { createSignalReceiver } from './receiver';

// The alarm receiving process started by `npm start`: SIA DC-09 over TCP on loopback, the HTTPS
// intake for IP communicators, and the sweep for missed periodic tests. It runs apart from the
// API so a burst of signals never competes with people's requests.
const config = loadConfig();
const logger = createLogger(config.logLevel, 'receiver');
const db = createDb(config.postgres);
const server = createSignalReceiver({ db, logger });

server.listen(config.monitoring.receiverPort, '127.0.0.1', () => {
  logger.info(`DC-09 receiver listening on 127.0.0.1:${config.monitoring.receiverPort}`);
});

const sweep = startMissedTestSweep(db, logger);

let intake: Server | null = null;
let stopping = false;
async function shutdown() {
  if (stopping) return;
  stopping = true;
  server.close();
  intake?.close();
  await sweep.stop();
  await db.destroy();
  process.exit(0);
}
process.once('SIGINT', () => void shutdown());
process.once('SIGTERM', () => void shutdown());

// DC-09 is the alarm path: if the intake cannot start (its port taken, its certificate
// unwritable), that is logged loudly and DC-09 carries on.
try {
  const tls = await loadOrCreateIntakeTls(config.dataDir);
  intake = createIntakeServer(createIntakeApp({ db, logger }), tls);
  intake.on('error', (error) => logger.error({ err: error }, 'the HTTPS intake stopped'));
  intake.listen(config.monitoring.intakePort, '127.0.0.1', () => {
    logger.info(
      `HTTPS signal intake listening on https://127.0.0.1:${config.monitoring.intakePort}/v1/signals (certificate ${tls.certPath})`,
    );
  });
} catch (error) {
  logger.error({ err: error }, 'the HTTPS intake could not start');
}
