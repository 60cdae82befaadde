import { Router, type Request } from 'express';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { z } from 'zod';
import { parseRequest } from '../http/validate';
import type { OidcClient } from './oidc-client';
import {
  auditSignIn,
  beginSignIn,
  completeSignIn,
  endSessionUrl,
  safeReturnPath,
  SignInError,
} from './service';

export interface AuthRouterDeps {
  db: Knex;
  oidc: OidcClient;
  logger: Logger;
  /** Browser-facing origins allowed to receive the callback; the first is the default. */
  appOrigins: string[];
}

const loginQuery = z.object({ returnTo: z.string().max(2000).optional() });

function saveSession(req: Request) {
  return new Promise<void>((resolve, reject) =>
    req.session.save((error) => (error ? reject(error) : resolve())),
  );
}

function regenerateSession(req: Request) {
  return new Promise<void>((resolve, reject) =>
    req.session.regenerate((error) => (error ? reject(error) : resolve())),
  );
}

/**
 * The origin the browser is using, if it is one of ours: Vite's dev server proxies with the
 * original Host header, and the redirect must return the person to the same origin.
 */
function browserOrigin(req: Request, appOrigins: string[]): string {
  const claimed = `${req.protocol}://${req.get('host') ?? ''}`;
  return appOrigins.includes(claimed) ? claimed : appOrigins[0]!;
}

export function createAuthRouter({ db, oidc, logger, appOrigins }: AuthRouterDeps): Router {
  const router = Router();

  // --- Sign-in: redirect to the identity provider with PKCE, state and nonce ---------------
  router.get('/auth/login', async function startSignIn(req, res) {
    const { returnTo } = parseRequest(loginQuery, req.query, 'query');
    const redirectUri = `${browserOrigin(req, appOrigins)}/auth/callback`;
    const { authorizationUrl, pending } = await beginSignIn(
      oidc,
      redirectUri,
      safeReturnPath(returnTo),
    );
    req.session.pendingSignIn = pending;
    await saveSession(req);
    res.redirect(303, authorizationUrl.toString());
  });

  // --- Callback: exchange the code, start a fresh session ----------------------------------
  router.get('/auth/callback', async function finishSignIn(req, res) {
    const pending = req.session.pendingSignIn;
    // A callback is good for one use whatever the outcome.
    delete req.session.pendingSignIn;
    const base = pending?.redirectUri ?? `${browserOrigin(req, appOrigins)}/auth/callback`;
    const callbackUrl = new URL(req.originalUrl, base);
    try {
      const { user, idToken } = await completeSignIn(db, oidc, pending, callbackUrl);
      // A new session id on sign-in, so a planted cookie never becomes a signed-in one.
      await regenerateSession(req);
      req.session.userId = user.id;
      req.session.idToken = idToken;
      req.session.signedInAt = Date.now();
      await saveSession(req);
      await auditSignIn(db, { user, succeeded: true, ip: req.ip, requestId: String(req.id) });
      res.redirect(303, pending!.returnTo);
    } catch (error) {
      if (!(error instanceof SignInError)) throw error;
      logger.warn({ reason: error.reason, detail: error.message }, 'sign-in refused');
      await saveSession(req);
      await auditSignIn(db, {
        succeeded: false,
        reason: error.reason,
        ip: req.ip,
        requestId: String(req.id),
      });
      res.redirect(303, `/signin-error?reason=${error.reason}`);
    }
  });

  // --- Sign-out: end our session, then the IdP's --------------------------------------------
  router.post('/auth/logout', async function signOut(req, res) {
    const idToken = req.session.idToken;
    const origin = browserOrigin(req, appOrigins);
    await new Promise<void>((resolve, reject) =>
      req.session.destroy((error) => (error ? reject(error) : resolve())),
    );
    res.clearCookie('wardbook.sid', { path: '/' });
    res.json({ redirectTo: await endSessionUrl(oidc, idToken, `${origin}/`) });
  });

  return router;
}
