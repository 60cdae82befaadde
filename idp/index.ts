import { createServer } from 'node:http';
import { loadConfig } from '../server/config/config';
import { loadOrCreateSecrets } from '../server/config/secrets';
import { createDb } from '../server/db/knex';
import { createLogger } from '../server/http/logger';
import { createSmtpMailer } from '../server/mail/mailer';
import { purgeExpiredPayloads } from './adapter';
import { createIdpApp } from './app';
import { loadOrCreateSigningKeys } from './keys';

// The identity provider process: its own port, its own keys, state in PostgreSQL.
const config = loadConfig();
const logger = createLogger(config.logLevel, 'idp');
const secrets = loadOrCreateSecrets(config.dataDir);
const db = createDb(config.postgres);
const mailer = createSmtpMailer({
  host: config.mail.smtpHost,
  port: config.mail.smtpPort,
  from: config.mail.from,
});

const { app } = createIdpApp({
  db,
  logger,
  mailer,
  issuer: config.idp.issuer,
  jwks: await loadOrCreateSigningKeys(config.dataDir),
  cookieKeys: secrets.idpCookieKeys,
  clientSecret: secrets.oidcClientSecret,
  pendingLoginKey: secrets.idpPendingLoginKey,
  appOrigins: config.idp.appOrigins,
});

const server = createServer(app);
server.listen(config.idp.port, '127.0.0.1', () => {
  logger.info(`identity provider listening on ${config.idp.issuer}`);
});

const purge = setInterval(
  () => {
    purgeExpiredPayloads(db).catch((error: unknown) => logger.warn({ err: error }, 'purge failed'));
  },
  15 * 60 * 1000,
);
purge.unref();

let stopping = false;
async function shutdown(signal: string) {
  // A terminal's Ctrl-C reaches this process and `npm start`'s supervisor alike.
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'identity provider stopping');
  clearInterval(purge);
  server.close();
  server.closeIdleConnections();
  mailer.close();
  await db.destroy();
  process.exit(0);
}
process.once('SIGINT', () => void shutdown('SIGINT'));
process.once('SIGTERM', () => void shutdown('SIGTERM'));
