import type { Request, RequestHandler } from 'express';
import { currentUser } from '../auth/current-user';
import type { Role } from '../users/roles';
import type { UserWithMemberships } from '../users/repository';
import { ForbiddenError, NotFoundError, NotSignedInError } from './errors';

/**
 * Guards every API route uses. Two questions, always both: does the caller hold a role that may
 * use this route (403 if not), and is the record inside that role's scope (404 if not, so that
 * records of other organisations or homeowners are not even confirmed to exist).
 */
export const requireSignedIn: RequestHandler = (req, _res, next) => {
  next(req.currentUser ? undefined : new NotSignedInError());
};

export function hasRole(user: UserWithMemberships, roles: readonly Role[]): boolean {
  return user.memberships.some((membership) => roles.includes(membership.role));
}

export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.currentUser) return next(new NotSignedInError());
    next(hasRole(req.currentUser, roles) ? undefined : new ForbiddenError());
  };
}

/** Organisations in which the user holds one of the roles. */
export function organisationIdsFor(user: UserWithMemberships, roles: readonly Role[]): string[] {
  return user.memberships
    .filter((membership) => roles.includes(membership.role) && membership.organisation)
    .map((membership) => membership.organisation!.id);
}

export type ScopeCheck = (user: UserWithMemberships, req: Request) => boolean | Promise<boolean>;

/** Refuses with 404 unless the record named by the request is within the caller's scope. */
export function requireScope(check: ScopeCheck): RequestHandler {
  return async (req, _res, next) => {
    const user = currentUser(req);
    next((await check(user, req)) ? undefined : new NotFoundError());
  };
}

/** Scope check for routes addressed by an organisation id in the path. */
export function inOrganisation(param: string, roles: readonly Role[]): ScopeCheck {
  return (user, req) => {
    const organisationId = req.params[param];
    return typeof organisationId === 'string'
      ? organisationIdsFor(user, roles).includes(organisationId)
      : false;
  };
}
