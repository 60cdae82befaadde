import { urlencoded, type Request, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';

/** The IdP's pages post small url-encoded forms; nothing bigger is accepted. */
export const formBody = urlencoded({ extended: false, limit: '10kb' });

export const WINDOW_MINUTES = 15;

/**
 * Per-IP limit on attempts (passwords, codes, reset requests) within a 15-minute window; over
 * it, the page is shown again with `message` and nothing is checked.
 */
export function attemptLimiter(limit: number, render: (req: Request, message: string) => string) {
  return rateLimit({
    windowMs: WINDOW_MINUTES * 60 * 1000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (req, res) =>
      sendPage(
        res,
        429,
        render(
          req,
          `Too many attempts from this network. Wait ${WINDOW_MINUTES} minutes and try again.`,
        ),
      ),
  });
}

export function sendPage(res: Response, status: number, page: string) {
  res.status(status).set('Cache-Control', 'no-store').type('html').send(page);
}
