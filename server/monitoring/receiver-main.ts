import { loadConfig } from '../config/config';
import { createDb } from '../db/knex';
import { createLogger } from '../http/logger';
import { createSignalReceiver } from './receiver';

// The alarm receiving process started by `npm start`: SIA DC-09 over TCP on loopback. It runs
// apart from the API so a burst of signals never competes with people's requests.
const config = loadConfig();
const logger = createLogger(config.logLevel, 'receiver');
const db = createDb(config.postgres);
const server = createSignalReceiver({ db, logger });

server.listen(config.monitoring.receiverPort, '127.0.0.1', () => {
  logger.info(`DC-09 receiver listening on 127.0.0.1:${config.monitoring.receiverPort}`);
});

let stopping = false;
async function shutdown() {
  if (stopping) return;
  stopping = true;
  server.close();
  await db.destroy();
  process.exit(0);
}
process.once('SIGINT', () => void shutdown());
process.once('SIGTERM', () => void shutdown());
