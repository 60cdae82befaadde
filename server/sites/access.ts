import type { RequestHandler, Request } from 'express';
import type { Knex } from 'knex';
import { currentUser } from '../auth/current-user';
import { ForbiddenError, NotFoundError } from '../http/errors';
import { organisationIdsFor } from '../http/guards';
import type { UserWithMemberships } from '../users/repository';

/**
 * How a person stands to one site. Staff relations come from their organisation (the site's
 * installer or monitoring centre); homeowner and keyholder relations from the site's own rows.
 */
export type SiteRelation = 'engineer' | 'office' | 'operator' | 'homeowner' | 'keyholder';

export interface SiteAccess {
  id: string;
  installerId: string;
  monitoringCentreId: string | null;
  relations: SiteRelation[];
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      siteAccess?: SiteAccess;
    }
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export async function relationsToSite(
  db: Knex,
  user: UserWithMemberships,
  siteId: string,
): Promise<SiteAccess | undefined> {
  if (!UUID.test(siteId)) return undefined;
  const row = await db('sites as s')
    .where('s.id', siteId)
    .first<
      | {
          id: string;
          installer_id: string;
          monitoring_centre_id: string | null;
          is_homeowner: boolean;
          is_keyholder: boolean;
        }
      | undefined
    >(
      's.id',
      's.installer_id',
      's.monitoring_centre_id',
      db.raw(
        'exists (select 1 from site_homeowners h where h.site_id = s.id and h.user_id = ?) as is_homeowner',
        [user.id],
      ),
      db.raw(
        'exists (select 1 from keyholders k where k.site_id = s.id and k.user_id = ?) as is_keyholder',
        [user.id],
      ),
    );
  if (!row) return undefined;
  const relations: SiteRelation[] = [];
  if (organisationIdsFor(user, ['engineer']).includes(row.installer_id)) relations.push('engineer');
  if (organisationIdsFor(user, ['office']).includes(row.installer_id)) relations.push('office');
  if (
    row.monitoring_centre_id &&
    organisationIdsFor(user, ['operator']).includes(row.monitoring_centre_id)
  ) {
    relations.push('operator');
  }
  if (row.is_homeowner && user.memberships.some((m) => m.role === 'homeowner'))
    relations.push('homeowner');
  if (row.is_keyholder && user.memberships.some((m) => m.role === 'keyholder'))
    relations.push('keyholder');
  return {
    id: row.id,
    installerId: row.installer_id,
    monitoringCentreId: row.monitoring_centre_id,
    relations,
  };
}

/**
 * The guard every /api/sites/:siteId route uses. No relation to the site: 404, so that other
 * companies' and other homeowners' sites are not even confirmed to exist. A relation that this
 * route does not serve (a keyholder asking for zones): 403.
 */
export function requireSiteRelation(db: Knex, ...allowed: SiteRelation[]): RequestHandler {
  return async (req, _res, next) => {
    const user = currentUser(req);
    const access = await relationsToSite(db, user, String(req.params.siteId));
    if (!access || access.relations.length === 0) return next(new NotFoundError());
    if (!access.relations.some((relation) => allowed.includes(relation))) {
      return next(new ForbiddenError('Your part in this site does not include this.'));
    }
    req.siteAccess = access;
    next();
  };
}

export function siteAccessOf(req: Request): SiteAccess {
  if (!req.siteAccess) throw new Error('requireSiteRelation must run before this handler');
  return req.siteAccess;
}

/** Whether the caller acts for the site's installer (engineer or office). */
export function isInstallerStaff(access: SiteAccess): boolean {
  return access.relations.includes('engineer') || access.relations.includes('office');
}

export const STAFF_WRITERS: SiteRelation[] = ['engineer', 'office'];
export const RECORD_READERS: SiteRelation[] = ['engineer', 'office', 'operator', 'homeowner'];
