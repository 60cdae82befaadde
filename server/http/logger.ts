import { randomUUID } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import { pino, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';

export function createLogger(level: string, name: string): Logger {
  return pino({
    name,
    level,
    // Credentials and session material never reach the logs.
    redact: {
      paths: [
        'req.headers.cookie',
        'req.headers.authorization',
        'req.headers["x-csrf-token"]',
        'res.headers["set-cookie"]',
        '*.password',
        '*.token',
        '*.code',
        '*.idToken',
      ],
      censor: '[redacted]',
    },
  });
}

const REQUEST_ID = /^[A-Za-z0-9._-]{1,64}$/;

/** Request logging with an id per request, taken from a trusted X-Request-Id or made up. */
export function requestLogger(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId(req: IncomingMessage, res) {
      const incoming = req.headers['x-request-id'];
      const id =
        typeof incoming === 'string' && REQUEST_ID.test(incoming) ? incoming : randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    // The query string can carry an authorization code or state on the sign-in callback.
    serializers: {
      req: (req: { id: string; method: string; url: string }) => ({
        id: req.id,
        method: req.method,
        path: req.url.split('?')[0],
      }),
    },
    customLogLevel(_req, res, error) {
      if (error || res.statusCode >= 500) return 'error';
      if (res.statusCode >= 400) return 'warn';
      return 'info';
    },
  });
}
