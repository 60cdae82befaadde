import type { RequestHandler } from 'express';
import { AppError } from './errors';
import { CODE_LIKE_FIELD } from '../user-slots/schema';

function findCodeLikePath(value: unknown, path: string[] = []): string[] | undefined {
  if (Array.isArray(value)) {
    for (const [index, item] of value.entries()) {
      const found = findCodeLikePath(item, [...path, String(index)]);
      if (found) return found;
    }
  } else if (value && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) {
      if (CODE_LIKE_FIELD.test(key)) return [...path, key];
      const found = findCodeLikePath(item, [...path, key]);
      if (found) return found;
    }
  }
  return undefined;
}

/**
 * Wardbook never takes an alarm user code: a request body carrying a field that looks like one
 * is refused before anything else reads it, and the value is never logged.
 */
export const refuseUserCodes: RequestHandler = (req, _res, next) => {
  const path = findCodeLikePath(req.body);
  if (!path) return next();
  const field = ['body', ...path].join('.');
  next(
    new AppError(
      400,
      'user-code-refused',
      'Codes are never sent to Wardbook',
      'Wardbook never asks for, stores or sends alarm user codes; they are set at the keypad. Remove the field and try again.',
      [{ path: field, message: 'Remove this: Wardbook does not take codes.' }],
    ),
  );
};
