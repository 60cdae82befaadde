import type { RequestHandler } from 'express';
import session, { type Store } from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type pg from 'pg';

/** What Wardbook keeps in a browser session, server-side in the sessions table. */
export interface PendingSignIn {
  state: string;
  nonce: string;
  codeVerifier: string;
  /** The callback URL this attempt registered, so dev (Vite) and built origins both work. */
  redirectUri: string;
  returnTo: string;
  startedAt: number;
}

declare module 'express-session' {
  interface SessionData {
    userId?: string;
    /** Kept only to end the IdP session on sign-out (id_token_hint). */
    idToken?: string;
    signedInAt?: number;
    pendingSignIn?: PendingSignIn;
  }
}

export const SESSION_COOKIE = 'wardbook.sid';
const EIGHT_HOURS = 8 * 60 * 60 * 1000;

export function createSessionStore(pool: pg.Pool): Store {
  const PgStore = connectPgSimple(session);
  return new PgStore({ pool, tableName: 'sessions', createTableIfMissing: false });
}

export function sessionMiddleware(options: {
  store: Store;
  secret: string;
  secureCookies: boolean;
}): RequestHandler {
  return session({
    name: SESSION_COOKIE,
    store: options.store,
    secret: options.secret,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      // Lax, not strict: the IdP's redirect back to /auth/callback must carry the cookie.
      sameSite: 'lax',
      secure: options.secureCookies,
      maxAge: EIGHT_HOURS,
      path: '/',
    },
  });
}
