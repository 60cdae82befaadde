import { createServer, type Server } from 'node:https';
import type { Express } from 'express';
import type { IntakeTls } from './tls';

/** The intake app over TLS 1.2 or later; the caller listens. */
export function createIntakeServer(app: Express, tls: Pick<IntakeTls, 'key' | 'cert'>): Server {
  return createServer({ key: tls.key, cert: tls.cert, minVersion: 'TLSv1.2' }, app);
}
