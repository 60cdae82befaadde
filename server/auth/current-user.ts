import type { RequestHandler, Request } from 'express';
import type { Knex } from 'knex';
import { NotSignedInError } from '../http/errors';
import { findUserById, type UserWithMemberships } from '../users/repository';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      currentUser?: UserWithMemberships;
    }
  }
}

/** Loads the signed-in user (if any) once per request; a disabled user is signed out. */
export function loadCurrentUser(db: Knex): RequestHandler {
  return async (req, _res, next) => {
    const userId = req.session?.userId;
    if (!userId) return next();
    const user = await findUserById(db, userId);
    if (!user || user.disabled) {
      await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
      return next();
    }
    req.currentUser = user;
    next();
  };
}

/** The signed-in user, for handlers behind requireSignedIn. */
export function currentUser(req: Request): UserWithMemberships {
  if (!req.currentUser) throw new NotSignedInError();
  return req.currentUser;
}
