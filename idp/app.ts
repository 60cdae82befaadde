import express, { type Express } from 'express';
import type { Knex } from 'knex';
import Provider from 'oidc-provider';
import type { Logger } from 'pino';
import { fileURLToPath } from 'node:url';
import { requestLogger } from '../server/http/logger';
import { securityHeaders } from '../server/http/security-headers';
import type { Mailer } from '../server/mail/mailer';
import { fontsDir, publicDir } from '../server/paths';
import { buildConfiguration } from './configuration';
import { sendPage } from './forms';
import { createInteractionRouter } from './interactions';
import type { Jwks } from './keys';
import { createPasswordRouter } from './passwords';
import { errorPage } from './views/pages';

export interface IdpDeps {
  db: Knex;
  logger: Logger;
  mailer: Mailer;
  issuer: string;
  jwks: Jwks;
  cookieKeys: string[];
  clientSecret: string;
  pendingLoginKey: string;
  /** Origins of the Wardbook app that may receive sign-in redirects; the first is canonical. */
  appOrigins: string[];
  /** Password and code attempts per IP per 15 minutes before the IdP refuses to check more. */
  attemptsPerWindow?: number;
}

const staticDir = fileURLToPath(new URL('./static', import.meta.url));

/** Builds the identity provider's web app. It never listens; idp/index.ts does. */
export function createIdpApp(deps: IdpDeps): { app: Express; provider: Provider } {
  const provider = new Provider(
    deps.issuer,
    buildConfiguration({
      db: deps.db,
      jwks: deps.jwks,
      cookieKeys: deps.cookieKeys,
      clientSecret: deps.clientSecret,
      appOrigins: deps.appOrigins,
    }),
  );
  const secure = deps.issuer.startsWith('https:');
  provider.proxy = false;

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(requestLogger(deps.logger));
  app.use(
    securityHeaders({
      secure,
      // Sign-in and sign-out forms end with a redirect back to the app.
      formTargets: deps.appOrigins,
      imgSources: ['data:'],
      referrerPolicy: 'no-referrer',
    }),
  );

  app.use('/static/fonts', express.static(fontsDir, { maxAge: '7d' }));
  app.use('/static/brand', express.static(publicDir, { maxAge: '1d' }));
  app.use('/static', express.static(staticDir, { maxAge: '1h' }));
  app.use(
    createInteractionRouter({
      db: deps.db,
      provider,
      pendingLoginKey: deps.pendingLoginKey,
      loginAttemptsPerWindow: deps.attemptsPerWindow ?? 30,
    }),
  );
  app.use(
    createPasswordRouter({
      db: deps.db,
      mailer: deps.mailer,
      issuer: deps.issuer,
      appUrl: deps.appOrigins[0]!,
      requestsPerWindow: deps.attemptsPerWindow ?? 30,
    }),
  );
  app.use(provider.callback());

  // Errors in our own routes (an expired interaction, say) get a page, never a stack trace.
  app.use(((error, _req, res, _next) => {
    const expired = (error as { name?: string }).name === 'SessionNotFound';
    if (!expired) deps.logger.error({ err: error }, 'idp request failed');
    sendPage(
      res,
      expired ? 400 : 500,
      errorPage({
        title: expired ? 'This sign-in has expired' : 'Something went wrong',
        message: expired
          ? 'The sign-in page was open too long or was already used. Start again from Wardbook.'
          : 'The sign-in service could not finish this request. Try again from Wardbook.',
        appUrl: deps.appOrigins[0]!,
      }),
    );
  }) as express.ErrorRequestHandler);

  return { app, provider };
}
