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

/** How often an active session's expiry is pushed back in the database. */
const TOUCH_INTERVAL_MS = 5 * 60 * 1000;

export function createSessionStore(pool: pg.Pool): Store {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({ pool, tableName: 'sessions', createTableIfMissing: false });
  // express-session touches the stored session on every request; a write per read is wasted
  // work, so within a few minutes of the last touch (by this process) it is skipped. The
  // session still lasts eight hours from its last use, give or take those minutes.
  const touch = store.touch.bind(store);
  const lastTouched = new Map<string, number>();
  store.touch = (sid, sess, callback) => {
    const now = Date.now();
    if (now - (lastTouched.get(sid) ?? 0) < TOUCH_INTERVAL_MS) return callback?.();
    if (lastTouched.size > 10_000) {
      for (const [key, at] of lastTouched)
        if (now - at >= TOUCH_INTERVAL_MS) lastTouched.delete(key);
    }
    lastTouched.set(sid, now);
    touch(sid, sess, callback);
  };
  return store;
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
