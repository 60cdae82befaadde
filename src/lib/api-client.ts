import { z } from 'zod';

/** One problem with one field of a request, as listed in a problem+json `errors` array. */
export type FieldError = { path: string; message: string };

// RFC 9457 problem details, with Wardbook's `requestId` and `errors` extensions.
const problemSchema = z.object({
  type: z.string().default('about:blank'),
  title: z.string().min(1),
  status: z.number().int(),
  detail: z.string().optional(),
  requestId: z.string().optional(),
  errors: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
});

export type Problem = z.infer<typeof problemSchema>;

/** The API answered, but with an error (or with something this client cannot read). */
export class ApiError extends Error {
  readonly status: number;
  readonly type: string;
  readonly title: string;
  readonly detail: string | undefined;
  readonly requestId: string | undefined;
  readonly fieldErrors: readonly FieldError[];

  constructor(problem: Problem) {
    super(problem.detail ? `${problem.title}. ${problem.detail}` : problem.title);
    this.name = 'ApiError';
    this.status = problem.status;
    this.type = problem.type;
    this.title = problem.title;
    this.detail = problem.detail;
    this.requestId = problem.requestId;
    this.fieldErrors = problem.errors ?? [];
  }

  /** The message for one form field, if the API objected to it. */
  messageFor(path: string): string | undefined {
    return this.fieldErrors.find((fieldError) => fieldError.path === path)?.message;
  }
}

/** The request never got an answer: offline, server down, or blocked on the way. */
export class NetworkError extends Error {
  constructor(cause: unknown) {
    super('Wardbook could not be reached. Check your connection and try again.', { cause });
    this.name = 'NetworkError';
  }
}

// Used when an error reply is not problem+json (a proxy page, an empty body), so people still
// read something better than a bare number.
const fallbackTitles: Record<number, string> = {
  400: 'The request was not accepted',
  401: 'You are not signed in',
  403: 'This is not available to your account',
  404: 'Not found',
  409: 'This was changed by someone else',
  413: 'That is too large to send',
  429: 'Too many requests. Wait a moment and try again',
  500: 'Wardbook hit a problem on the server',
  502: 'Wardbook is not answering at the moment',
  503: 'Wardbook is not answering at the moment',
  504: 'Wardbook is not answering at the moment',
};

function fallbackTitle(status: number): string {
  return (
    fallbackTitles[status] ??
    (status >= 500 ? 'Wardbook hit a problem on the server' : 'The request did not work')
  );
}

async function readJsonBody(response: Response): Promise<unknown> {
  const contentType = response.headers.get('content-type') ?? '';
  if (!/\bjson\b/i.test(contentType)) return undefined;
  try {
    return await response.json();
  } catch {
    return undefined;
  }
}

/** The error for a reply that was not OK, from its problem+json body when it has one. */
function errorFromProblemBody(status: number, payload: unknown): ApiError {
  const parsed = problemSchema.safeParse(payload);
  if (parsed.success) return new ApiError({ ...parsed.data, status });
  return new ApiError({ type: 'about:blank', title: fallbackTitle(status), status });
}

async function errorFromResponse(response: Response): Promise<ApiError> {
  return errorFromProblemBody(response.status, await readJsonBody(response));
}

function unexpectedReply(status: number, url: string, issues?: unknown): ApiError {
  // Developers need the details; people get a plain sentence.
  console.warn(`Unexpected reply from ${url}`, issues ?? 'not JSON');
  return new ApiError({
    type: 'about:blank',
    title: 'Wardbook sent a reply this page could not read',
    detail: 'Reload the page. If it keeps happening, the app may have just been updated.',
    status,
  });
}

/*
 * The session cookie is same-site and http-only, so the API also wants a CSRF token on every
 * request that changes something. It arrives with GET /api/me and is kept only in memory.
 */
let csrfToken: string | null = null;

export function setCsrfToken(token: string): void {
  csrfToken = token;
}

export function clearCsrfToken(): void {
  csrfToken = null;
}

/** For requests this module does not send itself, such as uploads that report progress. */
export function getCsrfToken(): string | null {
  return csrfToken;
}

type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

type RequestOptions<Schema extends z.ZodType> = {
  method?: HttpMethod;
  /** Sent as JSON, or as it is when a Blob (a File the person chose), typed by `contentType`. */
  body?: unknown;
  /** For a Blob body: what it is, e.g. application/pdf. Defaults to the Blob's own type. */
  contentType?: string;
  schema: Schema;
  signal?: AbortSignal;
};

export async function apiRequest<Schema extends z.ZodType>(
  url: string,
  { method = 'GET', body, contentType, schema, signal }: RequestOptions<Schema>,
): Promise<z.output<Schema>> {
  const headers = new Headers({ Accept: 'application/json, application/problem+json' });
  const isRawBody = body instanceof Blob;
  if (isRawBody) {
    headers.set('Content-Type', contentType ?? (body.type || 'application/octet-stream'));
  } else if (body !== undefined) {
    headers.set('Content-Type', 'application/json');
  }
  if (method !== 'GET' && csrfToken) headers.set('x-csrf-token', csrfToken);

  let response: Response;
  try {
    response = await fetch(url, {
      method,
      headers,
      body: body === undefined ? undefined : isRawBody ? body : JSON.stringify(body),
      credentials: 'same-origin',
      signal,
    });
  } catch (error) {
    // A cancelled query is not a failure; let TanStack Query see the abort as it is.
    if (signal?.aborted) throw error;
    throw new NetworkError(error);
  }

  if (!response.ok) throw await errorFromResponse(response);

  const payload = response.status === 204 ? undefined : await readJsonBody(response);
  const parsed = schema.safeParse(payload);
  if (!parsed.success) {
    throw unexpectedReply(
      response.status,
      url,
      payload === undefined ? undefined : parsed.error.issues,
    );
  }
  return parsed.data;
}

/** What a 204 No Content reply parses to. */
export const noContentSchema = z.undefined();

export const api = {
  get: <Schema extends z.ZodType>(
    url: string,
    schema: Schema,
    options?: { signal?: AbortSignal },
  ) => apiRequest(url, { schema, signal: options?.signal }),
  post: <Schema extends z.ZodType>(url: string, body: unknown, schema: Schema) =>
    apiRequest(url, { method: 'POST', body, schema }),
  put: <Schema extends z.ZodType>(url: string, body: unknown, schema: Schema) =>
    apiRequest(url, { method: 'PUT', body, schema }),
  patch: <Schema extends z.ZodType>(url: string, body: unknown, schema: Schema) =>
    apiRequest(url, { method: 'PATCH', body, schema }),
  delete: (url: string) => apiRequest(url, { method: 'DELETE', schema: noContentSchema }),
  /** Posts a file's bytes as the whole request body (no multipart wrapping). */
  postFile: <Schema extends z.ZodType>(
    url: string,
    file: Blob,
    contentType: string,
    schema: Schema,
  ) => apiRequest(url, { method: 'POST', body: file, contentType, schema }),
};

export type UploadProgress = { loadedBytes: number; totalBytes: number };

type UploadOptions<Schema extends z.ZodType> = {
  body: FormData;
  schema: Schema;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
};

/**
 * Sends a multipart form with XMLHttpRequest, because fetch cannot report how much of the request
 * body has gone. Errors are the same ApiError and NetworkError as for every other request.
 */
export function apiUpload<Schema extends z.ZodType>(
  url: string,
  { body, schema, onProgress, signal }: UploadOptions<Schema>,
): Promise<z.output<Schema>> {
  return new Promise((resolve, reject) => {
    const request = new XMLHttpRequest();
    request.open('POST', url);
    request.withCredentials = true;
    request.responseType = 'text';
    request.setRequestHeader('Accept', 'application/json, application/problem+json');
    if (csrfToken) request.setRequestHeader('x-csrf-token', csrfToken);

    request.upload.onprogress = (event) => {
      if (event.lengthComputable) {
        onProgress?.({ loadedBytes: event.loaded, totalBytes: event.total });
      }
    };
    request.onerror = () => reject(new NetworkError(new Error('The upload was interrupted.')));
    request.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    request.onload = () => {
      const contentType = request.getResponseHeader('content-type') ?? '';
      let payload: unknown;
      if (/\bjson\b/i.test(contentType)) {
        try {
          payload = JSON.parse(request.responseText);
        } catch {
          payload = undefined;
        }
      }
      if (request.status < 200 || request.status >= 300) {
        reject(errorFromProblemBody(request.status, payload));
        return;
      }
      const parsed = schema.safeParse(payload);
      if (parsed.success) resolve(parsed.data);
      else reject(unexpectedReply(request.status, url, parsed.error.issues));
    };

    if (signal?.aborted) {
      reject(new DOMException('The upload was cancelled.', 'AbortError'));
      return;
    }
    signal?.addEventListener('abort', () => request.abort(), { once: true });
    request.send(body);
  });
}
