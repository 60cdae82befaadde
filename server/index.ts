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
import { startPackBuildQueue } from './handover/build-queue';
import { ensureSealKeys, runPackBuild } from './handover/service';
import { resumeQueuedServiceReports, runServiceReport } from './service-report/service';
import { startCallOutEngine } from './monitoring/callout/engine';
import { createSmsSender } from './sms/sender';
import { startServiceReminderJobs } from './service-reminders/jobs';
import { sendServiceReminders } from './service-reminders/sweep';
import { ukDateOf } from './service/service';
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

const handoverDeps = {
  db,
  storage: createLocalDiskStorage(path.join(config.dataDir, 'files')),
  mailer,
  logger,
  publicUrl: config.api.publicUrl,
  sealKeySecret: secrets.sealKeySecret,
};
// Each installer's sealing key is made at first start (and for a new installer, on first issue).
await ensureSealKeys(db, secrets.sealKeySecret);
const buildQueue = await startPackBuildQueue({
  connection: config.postgres,
  logger,
  run: (buildId) => runPackBuild(handoverDeps, buildId),
});
// Service reports use the same durable job queue (a queue of their own) and the same renderer.
const serviceReportQueue = await startPackBuildQueue({
  connection: config.postgres,
  logger,
  queueName: 'service-report',
  run: (reportId) => runServiceReport(handoverDeps, reportId),
});
await resumeQueuedServiceReports(db, serviceReportQueue);

// Keyholder texts go out through the twilio SDK (to the local fake unless configured otherwise).
const sms = createSmsSender({
  accountSid: config.twilio.accountSid,
  authToken: secrets.twilioAuthToken,
  from: config.twilio.from,
  apiBaseUrl: config.twilio.apiBaseUrl,
});
const callOut = await startCallOutEngine({
  db,
  logger,
  sms,
  statusCallbackUrl: `${config.api.publicUrl}/api/webhooks/twilio/status`,
  connection: config.postgres,
});

// Homeowners hear before a visit is due and offices when one is overdue: an hourly durable job.
const reminders = await startServiceReminderJobs({
  connection: config.postgres,
  logger,
  run: () => sendServiceReminders({ db, mailer, sms, logger }, ukDateOf(new Date())),
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
  storage: handoverDeps.storage,
  idpIssuer: config.idp.issuer,
  sealKeySecret: secrets.sealKeySecret,
  buildQueue,
  serviceReportQueue,
  twilioAuthToken: secrets.twilioAuthToken,
  callOut,
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
  await buildQueue.stop().catch(() => undefined);
  await serviceReportQueue.stop().catch(() => undefined);
  await callOut.stop().catch(() => undefined);
  await reminders.stop().catch(() => undefined);
  mailer.close();
  await Promise.allSettled([db.destroy(), sessionPool.end()]);
  process.exit(0);
}
process.once('SIGINT', () => void shutdown('SIGINT'));
process.once('SIGTERM', () => void shutdown('SIGTERM'));
