import { randomBytes } from 'node:crypto';
import { mkdtemp, rm } from 'node:fs/promises';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { Store } from 'express-session';
import type { Knex } from 'knex';
import pg from 'pg';
import signature from 'cookie-signature';
import request from 'supertest';
import { inject } from 'vitest';
import { createApp } from '../../server/app';
import { createOidcClient } from '../../server/auth/oidc-client';
import { createSessionStore, SESSION_COOKIE } from '../../server/auth/session';
import { createLogger } from '../../server/http/logger';
import { createSmtpServer, Mailbox } from '../../server/fakes/smtp/mailbox';
import { createLocalDiskStorage, type FileStorage } from '../../server/files/storage';
import { createSmtpMailer, type Mailer } from '../../server/mail/mailer';
import { startPackBuildQueue } from '../../server/handover/build-queue';
import { runPackBuild } from '../../server/handover/service';
import { runServiceReport } from '../../server/service-report/service';
import './provided';

export interface ApiHarness {
  app: Express;
  store: Store;
  /** Everything the API e-mailed during the test file. */
  mailbox: Mailbox;
  /** The app's own mailer, delivering into `mailbox` (for jobs a test runs by hand). */
  mailer: Mailer;
  storage: FileStorage;
  /** A supertest agent already signed in as the user, with its CSRF token. */
  signedInAs(userId: string): Promise<{ agent: request.Agent; csrfToken: string; cookie: string }>;
  close(): Promise<void>;
}

/**
 * The real app, in-process, for API tests that are not about the sign-in flow itself.
 * Sessions are written into the real session store, exactly as the callback writes them.
 */
export async function buildApiHarness(
  db: Knex,
  options: {
    /** The origin the app believes it is served at (webhook signatures cover it). */
    publicUrl?: string;
    twilioAuthToken?: string;
    callOut?: { kick(): void };
  } = {},
): Promise<ApiHarness> {
  const pool = new pg.Pool({ ...inject('database'), max: 3 });
  const mailbox = new Mailbox();
  const smtp = createSmtpServer(mailbox);
  await new Promise<void>((resolve) => smtp.listen(0, '127.0.0.1', () => resolve()));
  const mailer = createSmtpMailer({
    host: '127.0.0.1',
    port: (smtp.server.address() as AddressInfo).port,
    from: 'Wardbook <no-reply@wardbook.example.com>',
  });
  const filesDir = await mkdtemp(path.join(os.tmpdir(), 'wardbook-files-'));
  const storage = createLocalDiskStorage(filesDir);
  const store = createSessionStore(pool);
  const secret = randomBytes(32).toString('base64url');
  const logger = createLogger(process.env.WARDBOOK_TEST_LOG_LEVEL ?? 'silent', 'test');
  const sealKeySecret = randomBytes(32).toString('base64url');
  const publicUrl = options.publicUrl ?? 'http://127.0.0.1:3000';
  // Its own queue: packs built by this app are stored on this app's disk.
  const buildQueue = await startPackBuildQueue({
    connection: inject('database'),
    logger,
    queueName: `issue-pack-${randomBytes(6).toString('hex')}`,
    run: (buildId) =>
      runPackBuild({ db, storage, mailer, logger, publicUrl, sealKeySecret }, buildId),
  });
  const serviceReportQueue = await startPackBuildQueue({
    connection: inject('database'),
    logger,
    queueName: `service-report-${randomBytes(6).toString('hex')}`,
    run: (reportId) => runServiceReport({ db, storage, mailer, logger }, reportId),
  });
  const app = createApp({
    db,
    logger,
    // Discovery is lazy; these tests never reach the identity provider.
    oidc: createOidcClient({
      issuer: 'http://127.0.0.1:9',
      clientId: 'unused',
      clientSecret: 'unused',
    }),
    sessionStore: store,
    sessionSecret: secret,
    appOrigins: [publicUrl],
    mailer,
    storage,
    idpIssuer: 'http://127.0.0.1:3001',
    sealKeySecret,
    buildQueue,
    serviceReportQueue,
    twilioAuthToken: options.twilioAuthToken,
    callOut: options.callOut,
  });

  return {
    app,
    store,
    mailbox,
    mailer,
    storage,
    async signedInAs(userId) {
      const sid = randomBytes(24).toString('base64url');
      const maxAge = 60 * 60 * 1000;
      await new Promise<void>((resolve, reject) =>
        store.set(
          sid,
          {
            cookie: {
              originalMaxAge: maxAge,
              expires: new Date(Date.now() + maxAge),
              httpOnly: true,
              path: '/',
            },
            userId,
            signedInAt: Date.now(),
          } as never,
          (error) => (error ? reject(error) : resolve()),
        ),
      );
      const cookie = `${SESSION_COOKIE}=${encodeURIComponent(`s:${signature.sign(sid, secret)}`)}`;
      const agent = request.agent(app).set('Cookie', cookie);
      const me = await agent.get('/api/me');
      return { agent, csrfToken: me.body.csrfToken as string, cookie };
    },
    async close() {
      await buildQueue.stop();
      await serviceReportQueue.stop();
      mailer.close();
      await new Promise((resolve) => smtp.close(() => resolve(undefined)));
      await rm(filesDir, { recursive: true, force: true });
      await pool.end();
    },
  };
}
