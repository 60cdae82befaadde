import { randomBytes } from 'node:crypto';
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
import './provided';

export interface ApiHarness {
  app: Express;
  store: Store;
  /** A supertest agent already signed in as the user, with its CSRF token. */
  signedInAs(userId: string): Promise<{ agent: request.Agent; csrfToken: string; cookie: string }>;
  close(): Promise<void>;
}

/**
 * The real app, in-process, for API tests that are not about the sign-in flow itself.
 * Sessions are written into the real session store, exactly as the callback writes them.
 */
export function buildApiHarness(db: Knex): ApiHarness {
  const pool = new pg.Pool({ ...inject('database'), max: 3 });
  const store = createSessionStore(pool);
  const secret = randomBytes(32).toString('base64url');
  const app = createApp({
    db,
    logger: createLogger('silent', 'test'),
    // Discovery is lazy; these tests never reach the identity provider.
    oidc: createOidcClient({
      issuer: 'http://127.0.0.1:9',
      clientId: 'unused',
      clientSecret: 'unused',
    }),
    sessionStore: store,
    sessionSecret: secret,
    appOrigins: ['http://127.0.0.1:3000'],
  });

  return {
    app,
    store,
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
    close: () => pool.end(),
  };
}
