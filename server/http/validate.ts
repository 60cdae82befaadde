import type { z } from 'zod';
import { ValidationError } from './errors';

type RequestPart = 'body' | 'query' | 'params';

/** Parses one part of a request with its zod schema, or throws field errors for the client. */
export function parseRequest<Schema extends z.ZodType>(
  schema: Schema,
  value: unknown,
  part: RequestPart,
): z.infer<Schema> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  throw new ValidationError(
    result.error.issues.map((issue) => ({
      path: [part, ...issue.path.map(String)].join('.'),
      message: issue.message,
    })),
  );
}
