import { createServer } from 'node:http';
import path from 'node:path';
import pg from 'pg';
import { createApp } from './app';
import { createOidcClient } from './auth/oidc-client';
import { createSessionStore } from './auth/session';
import { loadConfig } from './config/config';
import { loadOrCreateSecrets } from './config/secrets';
import { createDb } from './db/knex';
import { createLogger } from './http/logger';
import { createLocalDiskStorage } from './files/storage';
import { createSmtpMailer } from './mail/mailer';
import { OIDC_CLIENT_ID } from '../idp/clients';

// The API process: configuration, dependencies, listen, and a clean stop on SIGINT/SIGTERM.
const config = loadConfig();
const logger = createLogger(config.logLevel, 'api');
const secrets = loadOrCreateSecrets(config.dataDir);
const db = createDb(config.postgres);
const sessionPool = new pg.Pool({ ...config.postgres, max: 5 });
const mailer = createSmtpMailer({
  host: config.mail.smtpHost,
  port: config.mail.smtpPort,
  from: config.mail.from,
});

const app = createApp({
  db,
  logger,
  oidc: createOidcClient({
    issuer: config.idp.issuer,
    clientId: OIDC_CLIENT_ID,
    clientSecret: secrets.oidcClientSecret,
  }),
  sessionStore: createSessionStore(sessionPool),
  sessionSecret: secrets.sessionSecret,
  appOrigins: config.idp.appOrigins,
  clientDir: config.api.clientDir,
  mailer,
  storage: createLocalDiskStorage(path.join(config.dataDir, 'files')),
  idpIssuer: config.idp.issuer,
});

const server = createServer(app);
server.listen(config.api.port, '127.0.0.1', () => {
  logger.info(`API listening on http://127.0.0.1:${config.api.port}`);
});

let stopping = false;
async function shutdown(signal: string) {
  // A terminal's Ctrl-C reaches this process and `npm start`'s supervisor alike.
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'API stopping');
  server.close();
  server.closeIdleConnections();
  mailer.close();
  await Promise.allSettled([db.destroy(), sessionPool.end()]);
  process.exit(0);
}
process.once('SIGINT', () => void shutdown('SIGINT'));
process.once('SIGTERM', () => void shutdown('SIGTERM'));
