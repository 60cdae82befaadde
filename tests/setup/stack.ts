import { randomBytes } from 'node:crypto';
import { mkdtemp, rm } from 'node:fs/promises';
import { createServer } from 'node:http';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import pg from 'pg';
import { createApp } from '../../server/app';
import { createOidcClient } from '../../server/auth/oidc-client';
import { createSessionStore } from '../../server/auth/session';
import { LOCAL_TWILIO_ACCOUNT_SID, LOCAL_TWILIO_FROM } from '../../server/config/config';
import { generateSecrets } from '../../server/config/secrets';
import { createDb, type DatabaseConnection } from '../../server/db/knex';
import { createMailViewer } from '../../server/fakes/smtp/viewer';
import { createSmtpServer, Mailbox } from '../../server/fakes/smtp/mailbox';
import { createTwilioFake, type TwilioFake } from '../../server/fakes/twilio/app';
import { createLocalDiskStorage } from '../../server/files/storage';
import { createLogger } from '../../server/http/logger';
import { createSmtpMailer } from '../../server/mail/mailer';
import { startPackBuildQueue } from '../../server/handover/build-queue';
import { runPackBuild } from '../../server/handover/service';
import { startCallOutEngine, type CallOutEngine } from '../../server/monitoring/callout/engine';
import { createSmsSender } from '../../server/sms/sender';
import { createIdpApp } from '../../idp/app';
import { OIDC_CLIENT_ID } from '../../idp/clients';
import { generateSigningKeys } from '../../idp/keys';

export interface RunningStack {
  apiUrl: string;
  idpUrl: string;
  mailUrl: string;
  mailbox: Mailbox;
  /** The Twilio fake's page and API; the SDK's `apiBaseUrl`. */
  smsUrl: string;
  sms: TwilioFake;
  /** The auth token the Twilio fake checks and signs with. */
  twilioAuthToken: string;
  /** Sends keyholder texts from the outbox. */
  callOut: CallOutEngine;
  stop(): Promise<void>;
}

function portOf(server: { address(): string | AddressInfo | null }) {
  return (server.address() as AddressInfo).port;
}

/**
 * The whole of Wardbook in this process, on free loopback ports: mail catcher, Twilio fake,
 * identity provider and API (optionally serving a built client), each built the way its own
 * process builds it. Fresh secrets and signing keys every time.
 */
export async function startStack(options: {
  database: DatabaseConnection;
  clientDir?: string;
  attemptsPerWindow?: number;
  /**
   * Whether this stack sends keyholder texts. API test files share one database, so only the
   * file about texts runs a sender there; otherwise two would race for each other's messages.
   */
  sendTexts?: boolean;
}): Promise<RunningStack> {
  const logger = createLogger(process.env.WARDBOOK_TEST_LOG_LEVEL ?? 'silent', 'test');
  const apiServer = createServer();
  const idpServer = createServer();
  const viewerServer = createServer();
  const smsServer = createServer();
  const servers = [apiServer, idpServer, viewerServer, smsServer];
  for (const server of servers) {
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  }
  const mailbox = new Mailbox();
  const smtp = createSmtpServer(mailbox);
  await new Promise<void>((resolve) => smtp.listen(0, '127.0.0.1', () => resolve()));
  const smtpPort = portOf(smtp.server);

  const apiUrl = `http://127.0.0.1:${portOf(apiServer)}`;
  const idpUrl = `http://127.0.0.1:${portOf(idpServer)}`;
  const mailUrl = `http://127.0.0.1:${portOf(viewerServer)}`;
  const smsUrl = `http://127.0.0.1:${portOf(smsServer)}`;
  const secrets = generateSecrets();
  const sms = createTwilioFake({
    accountSid: LOCAL_TWILIO_ACCOUNT_SID,
    authToken: secrets.twilioAuthToken,
    publicUrl: smsUrl,
    inboundWebhookUrl: `${apiUrl}/api/webhooks/twilio/inbound`,
    phoneNumber: LOCAL_TWILIO_FROM,
  });
  const filesDir = await mkdtemp(path.join(os.tmpdir(), 'wardbook-files-'));
  const db = createDb(options.database, 10);
  const mailer = createSmtpMailer({
    host: '127.0.0.1',
    port: smtpPort,
    from: 'Wardbook <no-reply@wardbook.example.com>',
  });

  const { app: idpApp } = createIdpApp({
    db,
    logger,
    mailer,
    issuer: idpUrl,
    jwks: await generateSigningKeys(),
    cookieKeys: secrets.idpCookieKeys,
    clientSecret: secrets.oidcClientSecret,
    pendingLoginKey: secrets.idpPendingLoginKey,
    appOrigins: [apiUrl],
    attemptsPerWindow: options.attemptsPerWindow,
  });
  idpServer.on('request', idpApp);

  const sessionPool = new pg.Pool({ ...options.database, max: 5 });
  const storage = createLocalDiskStorage(filesDir);
  const buildQueue = await startPackBuildQueue({
    connection: options.database,
    logger,
    queueName: `issue-pack-${randomBytes(6).toString('hex')}`,
    run: (buildId) =>
      runPackBuild(
        { db, storage, mailer, logger, publicUrl: apiUrl, sealKeySecret: secrets.sealKeySecret },
        buildId,
      ),
  });
  const callOut = await startCallOutEngine({
    enabled: options.sendTexts ?? true,
    db,
    logger,
    sms: createSmsSender({
      accountSid: LOCAL_TWILIO_ACCOUNT_SID,
      authToken: secrets.twilioAuthToken,
      from: LOCAL_TWILIO_FROM,
      apiBaseUrl: smsUrl,
    }),
    statusCallbackUrl: `${apiUrl}/api/webhooks/twilio/status`,
    connection: options.database,
    queueName: `keyholder-escalation-${randomBytes(6).toString('hex')}`,
  });
  const app = createApp({
    db,
    logger,
    oidc: createOidcClient({
      issuer: idpUrl,
      clientId: OIDC_CLIENT_ID,
      clientSecret: secrets.oidcClientSecret,
    }),
    sessionStore: createSessionStore(sessionPool),
    sessionSecret: secrets.sessionSecret,
    appOrigins: [apiUrl],
    clientDir: options.clientDir,
    mailer,
    storage,
    idpIssuer: idpUrl,
    sealKeySecret: secrets.sealKeySecret,
    buildQueue,
    twilioAuthToken: secrets.twilioAuthToken,
    callOut,
  });
  apiServer.on('request', app);
  viewerServer.on('request', createMailViewer(mailbox));
  smsServer.on('request', sms.app);

  return {
    apiUrl,
    idpUrl,
    mailUrl,
    mailbox,
    smsUrl,
    sms,
    twilioAuthToken: secrets.twilioAuthToken,
    callOut,
    async stop() {
      sms.close();
      for (const server of servers) {
        server.closeAllConnections();
        await new Promise((resolve) => server.close(resolve));
      }
      await buildQueue.stop();
      await callOut.stop();
      await new Promise((resolve) => smtp.close(() => resolve(undefined)));
      mailer.close();
      await Promise.all([db.destroy(), sessionPool.end()]);
      await rm(filesDir, { recursive: true, force: true });
    },
  };
}
