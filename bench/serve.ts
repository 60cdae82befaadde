import { createServer } from 'node:http';
import path from 'node:path';
import express from 'express';
import pg from 'pg';
import { createApp } from '../server/app';
import { createOidcClient } from '../server/auth/oidc-client';
import { createSessionStore } from '../server/auth/session';
import { loadConfig } from '../server/config/config';
import { createDb } from '../server/db/knex';
import { createLocalDiskStorage } from '../server/files/storage';
import { createLogger } from '../server/http/logger';
import { createSmtpMailer } from '../server/mail/mailer';

/**
 * A benchmark server in its own process, so the load generator does not share its event
 * loop: `wardbook` is the real app on the bench database, `bare` a bare Express handler.
 * Prints "listening <port>" when ready.
 */
const mode = process.argv[2];
let app: express.Express;
if (mode === 'bare') {
  app = express();
  app.get(/.*/, (_req, res) => {
    res.json({ status: 'ok' });
  });
} else {
  const config = loadConfig();
  const database = { ...config.postgres, database: process.env.BENCH_DATABASE! };
  app = createApp({
    db: createDb(database, 20),
    logger: createLogger('silent', 'bench'),
    oidc: createOidcClient({ issuer: 'http://127.0.0.1:9', clientId: 'x', clientSecret: 'x' }),
    sessionStore: createSessionStore(new pg.Pool({ ...database, max: 10 })),
    sessionSecret: process.env.BENCH_SESSION_SECRET!,
    appOrigins: ['http://127.0.0.1:3000'],
    mailer: createSmtpMailer({ host: '127.0.0.1', port: 9, from: 'bench@example.com' }),
    storage: createLocalDiskStorage(path.join(config.dataDir, 'bench-files')),
    idpIssuer: 'http://127.0.0.1:9',
    sealKeySecret: 'bench-only-secret-bench-only-secret-0000',
  });
}
const server = createServer(app);
server.listen(0, '127.0.0.1', () => {
  const address = server.address() as { port: number };
  console.log(`listening ${address.port}`);
});
process.on('SIGTERM', () => process.exit(0));
