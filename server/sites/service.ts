import type { Knex } from 'knex';
import type { z } from 'zod';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { NotFoundError, ValidationError } from '../http/errors';
import { changedFields, updateAtVersion } from '../http/versioned-update';
import { organisationIdsFor } from '../http/guards';
import type { UserWithMemberships } from '../users/repository';
import type { SiteAccess } from './access';
import {
  findSiteRow,
  getSiteDetail,
  insertSite,
  replaceEngineers,
  toColumns,
  type SiteRow,
  type SiteValues,
} from './repository';
import { siteConsistencyProblems, type createSiteSchema, type updateSiteSchema } from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;

async function checkMonitoringCentre(db: Knex, monitoringCentreId: unknown) {
  if (!monitoringCentreId) return;
  const centre = await db('organisations')
    .where({ id: monitoringCentreId, kind: 'monitoring_centre' })
    .first('id');
  if (!centre) {
    throw new ValidationError([
      { path: 'body.monitoringCentreId', message: 'Choose a monitoring centre from the list.' },
    ]);
  }
}

/** The database's unique constraints, turned into the field errors people can act on. */
function explainUniqueViolation(error: unknown): never {
  const { code, constraint } = error as { code?: string; constraint?: string };
  if (code === '23505' && constraint === 'sites_monitoring_centre_id_monitoring_account_unique') {
    throw new ValidationError([
      {
        path: 'body.monitoringAccount',
        message: 'That account number is already in use at this monitoring centre.',
      },
    ]);
  }
  throw error;
}

export async function requireSite(db: Knex, siteId: string) {
  const detail = await getSiteDetail(db, siteId);
  if (!detail) throw new NotFoundError();
  return detail;
}

export async function createSite(
  db: Knex,
  user: UserWithMemberships,
  input: z.output<typeof createSiteSchema>,
  actor: Actor,
) {
  const installers = organisationIdsFor(user, ['engineer', 'office']);
  const installerId = input.installerId ?? (installers.length === 1 ? installers[0] : undefined);
  if (!installerId || !installers.includes(installerId)) {
    throw new ValidationError([
      { path: 'body.installerId', message: 'Choose which of your companies maintains this site.' },
    ]);
  }
  await checkMonitoringCentre(db, input.monitoringCentreId);
  const { installerId: _chosen, ...values } = input;
  const site = await db
    .transaction(async (trx) => {
      const row = await insertSite(trx, installerId, values);
      await recordAuditEntry(trx, {
        ...actor,
        action: 'site.created',
        entityType: 'site',
        entityId: row.id,
        organisationId: installerId,
        summary: `Created site ${row.reference} ${row.name}`,
        changes: toColumns(values),
      });
      return row;
    })
    .catch(explainUniqueViolation);
  return requireSite(db, site.id);
}

export async function updateSite(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof updateSiteSchema>,
  actor: Actor,
) {
  const { version, ...patch } = input;
  const before = await findSiteRow(db, access.id);
  if (!before) throw new NotFoundError();
  // Cross-field rules are checked on the record as it would be after this edit.
  const merged = {
    policeUrn: before.police_urn,
    urnStatus: before.urn_status,
    monitoringCentreId: before.monitoring_centre_id,
    monitoringAccount: before.monitoring_account,
    ...patch,
  };
  const problems = siteConsistencyProblems(merged);
  if (problems.length) {
    throw new ValidationError(
      problems.map(({ path, message }) => ({ path: ['body', ...path].join('.'), message })),
    );
  }
  await checkMonitoringCentre(db, patch.monitoringCentreId);

  await db
    .transaction(async (trx) => {
      const after = await updateAtVersion<SiteRow>(trx, 'sites', { id: access.id }, version, {
        ...toColumns(patch as SiteValues),
        updated_at: trx.fn.now(),
      });
      await recordAuditEntry(trx, {
        ...actor,
        action: 'site.updated',
        entityType: 'site',
        entityId: access.id,
        organisationId: access.installerId,
        summary: `Updated site ${after.reference} ${after.name}`,
        changes: changedFields(
          before as unknown as Record<string, unknown>,
          after as unknown as Record<string, unknown>,
        ),
      });
    })
    .catch(explainUniqueViolation);
  return requireSite(db, access.id);
}

export async function assignEngineers(
  db: Knex,
  access: SiteAccess,
  userIds: string[],
  actor: Actor,
) {
  const unique = [...new Set(userIds)];
  const engineers = await db('memberships')
    .where({ organisation_id: access.installerId, role: 'engineer' })
    .whereIn('user_id', unique)
    .pluck('user_id');
  const strangers = unique.filter((id) => !engineers.includes(id));
  if (strangers.length) {
    throw new ValidationError([
      { path: 'body.userIds', message: 'Only engineers of this company can be assigned.' },
    ]);
  }
  await db.transaction(async (trx) => {
    const before = await trx('site_engineers').where({ site_id: access.id }).pluck('user_id');
    await replaceEngineers(trx, access.id, unique);
    await recordAuditEntry(trx, {
      ...actor,
      action: 'site.engineers_assigned',
      entityType: 'site',
      entityId: access.id,
      organisationId: access.installerId,
      summary: `Assigned ${unique.length} engineer(s)`,
      changes: { engineers: { from: before, to: unique } },
    });
  });
  return requireSite(db, access.id);
}
