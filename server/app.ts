import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import type { Store } from 'express-session';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { csrfSync } from 'csrf-sync';
import { loadCurrentUser } from './auth/current-user';
import type { OidcClient } from './auth/oidc-client';
import { createAuthRouter } from './auth/routes';
import { sessionMiddleware } from './auth/session';
import { createHealthRouter } from './health/routes';
import { createHomesRouter } from './homes/routes';
import { requestLogger } from './http/logger';
import { apiNotFound, problemHandler } from './http/problem-handler';
import { securityHeaders } from './http/security-headers';
import { createCalculatorsRouter } from './calculators/routes';
import { createChangeRequestsRouter } from './change-requests/routes';
import { createCommissioningRouter } from './commissioning/routes';
import { createDevicesRouter } from './devices/routes';
import { createFilesRouter } from './files/routes';
import type { FileStorage } from './files/storage';
import { refuseUserCodes } from './http/refuse-user-codes';
import { createKeyholdersRouter } from './keyholders/routes';
import type { Mailer } from './mail/mailer';
import { createMeRouter } from './me/routes';
import { createMyRouter } from './my/routes';
import { createSitesRouter } from './sites/routes';
import { createSystemsRouter } from './systems/routes';
import { createUserSlotsRouter } from './user-slots/routes';
import { createZonesRouter } from './zones/routes';
import { createOrganisationsRouter } from './organisations/routes';
import type { PackBuildQueue } from './handover/build-queue';
import { createHandoverRouter, createVerifyRouter } from './handover/routes';
import { createMonitoringRouter } from './monitoring/routes';
import { createSignallingCredentialsRouter } from './monitoring/credentials/routes';
import { createTwilioWebhookRouter } from './monitoring/callout/webhooks';
import { createKeyholderAlertsRouter } from './keyholder-alerts/routes';
import { createSignalHistoryRouter } from './signal-history/routes';
import { createServiceRouter } from './service/routes';
import { createFaultsRouter } from './faults/routes';
import { createServiceHistoryRouter } from './service-history/routes';
import { createServiceReportRouter } from './service-report/routes';

export interface AppDeps {
  db: Knex;
  logger: Logger;
  oidc: OidcClient;
  sessionStore: Store;
  sessionSecret: string;
  /** Browser-facing origins; the first is canonical. Cookies go secure when it is https. */
  appOrigins: string[];
  /** Folder of the built client (vite build). Omitted in API-only tests. */
  clientDir?: string;
  mailer: Mailer;
  storage: FileStorage;
  /** The identity provider's address, for links in invitation e-mails. */
  idpIssuer: string;
  /** Encrypts the companies' seal private keys at rest. */
  sealKeySecret: string;
  /** Builds handover packs off the request path; without it a build runs within the request. */
  buildQueue?: PackBuildQueue;
  /** Draws service reports off the request path; without it a report is drawn in the request. */
  serviceReportQueue?: PackBuildQueue;
  /** Checks the signatures on Twilio's webhooks; without it every webhook is refused. */
  twilioAuthToken?: string;
  /** Sends queued keyholder texts now (server/monitoring/callout/engine.ts). */
  callOut?: { kick(): void };
}

/** Builds the Wardbook API and web app. It never listens; server/index.ts does. */
export function createApp(deps: AppDeps): Express {
  const app = express();
  const secure = deps.appOrigins[0]!.startsWith('https:');
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');

  app.use(requestLogger(deps.logger));
  app.use(securityHeaders({ secure, imgSources: ['data:', 'blob:'] }));

  // --- Health and static files: no session needed --------------------------------------------
  app.use(createHealthRouter(deps));
  const clientIndex = deps.clientDir ? path.join(deps.clientDir, 'index.html') : undefined;
  if (deps.clientDir) {
    app.use(
      '/assets',
      express.static(path.join(deps.clientDir, 'assets'), { immutable: true, maxAge: '1y' }),
    );
    app.use(express.static(deps.clientDir, { index: false }));
  }

  // --- Public pack verification: no session, and nothing it does changes anything -----------------
  app.use(createVerifyRouter(deps));

  // --- Twilio's webhooks: no session; each request must carry Twilio's signature ---------------
  app.use(createTwilioWebhookRouter({ ...deps, publicUrl: deps.appOrigins[0]! }));

  // --- Sessions, the signed-in user and CSRF ---------------------------------------------------
  // Drawn signatures are PNG images: their routes take bodies up to twice the image limit.
  app.use(
    [
      '/api/sites/:siteId/handover/signatures',
      '/api/my/signing-requests/:requestId/sign',
      '/api/service/visits/:visitId/complete',
    ],
    express.json({ limit: '600kb' }),
  );
  app.use(express.json({ limit: '100kb' }));
  app.use(
    sessionMiddleware({
      store: deps.sessionStore,
      secret: deps.sessionSecret,
      secureCookies: secure,
    }),
  );
  app.use(loadCurrentUser(deps.db));
  const csrf = csrfSync({
    getTokenFromRequest: (req) => req.get('x-csrf-token'),
  });
  app.use(['/api', '/auth/logout'], csrf.csrfSynchronisedProtection);

  // --- Routes ----------------------------------------------------------------------------------
  app.use(createAuthRouter({ ...deps, appOrigins: deps.appOrigins }));
  app.use(
    createMeRouter({ generateCsrfToken: (req) => csrf.generateToken(req as express.Request) }),
  );
  app.use(createHomesRouter(deps));
  app.use(createOrganisationsRouter(deps));

  // The as-fitted record. No request body under /api/sites may carry an alarm user code.
  const records = { ...deps, appUrl: deps.appOrigins[0]! };
  app.use('/api/sites', refuseUserCodes);
  app.use(createSitesRouter(records));
  app.use(createSystemsRouter(records));
  app.use(createZonesRouter(records));
  app.use(createDevicesRouter(records));
  app.use(createKeyholdersRouter(records));
  app.use(createUserSlotsRouter(records));
  app.use(createFilesRouter(records));
  app.use(createChangeRequestsRouter(records));
  app.use(createMyRouter(records));
  app.use(createCalculatorsRouter());
  app.use(createCommissioningRouter(records));
  app.use(
    createHandoverRouter({
      db: deps.db,
      storage: deps.storage,
      mailer: deps.mailer,
      logger: deps.logger,
      publicUrl: deps.appOrigins[0]!,
      sealKeySecret: deps.sealKeySecret,
      buildQueue: deps.buildQueue,
    }),
  );
  app.use(createMonitoringRouter(deps));
  app.use(createSignallingCredentialsRouter(deps));
  app.use(createKeyholderAlertsRouter(deps));
  app.use(createSignalHistoryRouter(deps));
  app.use(createServiceRouter(deps));
  app.use(createServiceReportRouter(deps));
  app.use(createFaultsRouter(records));
  app.use(createServiceHistoryRouter(deps));
  app.use('/api', apiNotFound);

  // --- The single-page app answers every other GET ---------------------------------------------
  app.get(/^(?!\/(api|auth)\/).*/, function clientPage(_req, res) {
    if (!clientIndex || !existsSync(clientIndex)) {
      res.status(503).type('text').send('The Wardbook client is not built yet. Run: npm run build');
      return;
    }
    // With `root`, a dot folder in the install path (.data/…) is not mistaken for a dotfile.
    res.set('Cache-Control', 'no-cache').sendFile('index.html', { root: deps.clientDir });
  });

  app.use(problemHandler(deps.logger));
  return app;
}
