import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import { AppError, NotFoundError, type FieldError } from './errors';

interface Problem {
  type: string;
  title: string;
  status: number;
  detail?: string;
  instance?: string;
  requestId?: string;
  errors?: FieldError[];
}

/** Errors from Express and its middleware (body parser, CSRF) carry an HTTP status. */
interface HttpStatusError {
  status?: number;
  statusCode?: number;
  expose?: boolean;
  message?: string;
  code?: string;
  type?: string;
}

const readableHttpErrors: Record<string, { slug: string; title: string; detail: string }> = {
  EBADCSRFTOKEN: {
    slug: 'csrf',
    title: 'Security check failed',
    detail: 'The request was missing its security token. Reload the page and try again.',
  },
  'entity.parse.failed': {
    slug: 'malformed-body',
    title: 'Malformed request',
    detail: 'The request body is not valid JSON.',
  },
  'entity.too.large': {
    slug: 'too-large',
    title: 'Request too large',
    detail: 'The request body is larger than allowed.',
  },
};

function toProblem(error: unknown): Problem {
  if (error instanceof AppError) {
    return {
      type: `/problems/${error.slug}`,
      title: error.title,
      status: error.status,
      detail: error.detail,
      errors: error.fieldErrors,
    };
  }
  const http = (error ?? {}) as HttpStatusError;
  const status = http.status ?? http.statusCode;
  if (status && status >= 400 && status < 500) {
    const known = readableHttpErrors[http.code ?? http.type ?? ''];
    return {
      type: `/problems/${known?.slug ?? 'bad-request'}`,
      title: known?.title ?? 'Bad request',
      status,
      detail: known?.detail ?? (http.expose ? http.message : undefined),
    };
  }
  return {
    type: '/problems/internal',
    title: 'Something went wrong',
    status: 500,
    detail: 'Wardbook could not finish this request. Nothing was changed; try again shortly.',
  };
}

export function problemHandler(logger: Logger): ErrorRequestHandler {
  return (error, req, res, next) => {
    if (res.headersSent) return next(error);
    const problem = toProblem(error);
    problem.instance = req.originalUrl;
    problem.requestId = String(req.id ?? '');
    if (problem.status >= 500) logger.error({ err: error, requestId: req.id }, 'request failed');
    res.status(problem.status).type('application/problem+json').json(problem);
  };
}

export const apiNotFound: RequestHandler = (_req, _res, next) => {
  next(new NotFoundError('No such API route.'));
};
