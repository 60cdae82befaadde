import { Router } from 'express';
import type { Knex } from 'knex';
import { listAuditForOrganisation } from '../audit/repository';
import { NotFoundError } from '../http/errors';
import { inOrganisation, requireRole, requireScope } from '../http/guards';
import { parseRequest } from '../http/validate';
import { listOrganisationMembers } from '../users/repository';
import { STAFF_ROLES } from '../users/roles';
import { countMembersByRole, findOrganisation } from './repository';
import { auditQuery, organisationParams } from './schema';

export function createOrganisationsRouter({ db }: { db: Knex }): Router {
  const router = Router();
  const params = (value: unknown) => parseRequest(organisationParams, value, 'params');

  // Any staff member of the organisation may read its summary.
  router.get(
    '/api/organisations/:organisationId',
    requireRole(...STAFF_ROLES),
    requireScope(inOrganisation('organisationId', STAFF_ROLES)),
    async function organisationSummary(req, res) {
      const { organisationId } = params(req.params);
      const organisation = await findOrganisation(db, organisationId);
      if (!organisation) throw new NotFoundError();
      res.json({ organisation, membersByRole: await countMembersByRole(db, organisationId) });
    },
  );

  // The office manages the installer's people; operators see their centre's colleagues.
  router.get(
    '/api/organisations/:organisationId/members',
    requireRole('office', 'operator'),
    requireScope(inOrganisation('organisationId', ['office', 'operator'])),
    async function organisationMembers(req, res) {
      const { organisationId } = params(req.params);
      res.json({ members: await listOrganisationMembers(db, organisationId) });
    },
  );

  router.get(
    '/api/organisations/:organisationId/audit',
    requireRole('office'),
    requireScope(inOrganisation('organisationId', ['office'])),
    async function organisationAudit(req, res) {
      const { organisationId } = params(req.params);
      const { limit, before } = parseRequest(auditQuery, req.query, 'query');
      const entries = await listAuditForOrganisation(db, organisationId, limit, before);
      res.json({
        entries,
        nextBefore: entries.length === limit ? Number(entries.at(-1)!.id) : null,
      });
    },
  );

  return router;
}
