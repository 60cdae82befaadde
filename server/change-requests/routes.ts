import { Router } from 'express';
import { z } from 'zod';
import { actorOf } from '../audit/actor';
import { recordAuditEntry } from '../audit/repository';
import { NotFoundError } from '../http/errors';
import { parseRequest } from '../http/validate';
import type { InvitationDeps } from '../invitations/service';
import { requireSiteRelation, siteAccessOf, STAFF_WRITERS } from '../sites/access';
import { createChangeRequestSchema, updateChangeRequestSchema, type ChangeRequest } from './schema';

const requestParams = z.object({ requestId: z.uuid() });

interface ChangeRequestRow {
  id: string;
  subject: string;
  details: string;
  status: 'open' | 'closed';
  requested_by_name: string | null;
  created_at: Date;
}

const toChangeRequest = (row: ChangeRequestRow): ChangeRequest => ({
  id: row.id,
  subject: row.subject,
  details: row.details,
  status: row.status,
  requestedBy: row.requested_by_name,
  createdAt: row.created_at.toISOString(),
});

/** Homeowners ask their installer for changes; the installer's office and engineers see them. */
export function createChangeRequestsRouter(
  deps: Pick<InvitationDeps, 'db' | 'mailer' | 'appUrl'>,
): Router {
  const { db } = deps;
  const router = Router();
  const query = (siteId: string) =>
    db('change_requests as r')
      .leftJoin('users as u', 'u.id', 'r.requested_by')
      .where('r.site_id', siteId)
      .select<ChangeRequestRow[]>(
        'r.id',
        'r.subject',
        'r.details',
        'r.status',
        'r.created_at',
        'u.display_name as requested_by_name',
      );

  router.get(
    '/api/sites/:siteId/change-requests',
    requireSiteRelation(db, 'engineer', 'office', 'homeowner'),
    async function changeRequests(req, res) {
      const rows = await query(siteAccessOf(req).id).orderBy('r.created_at', 'desc');
      res.json({ changeRequests: rows.map(toChangeRequest) });
    },
  );

  router.post(
    '/api/sites/:siteId/change-requests',
    requireSiteRelation(db, 'homeowner'),
    async function changeRequestCreate(req, res) {
      const input = parseRequest(createChangeRequestSchema, req.body, 'body');
      const access = siteAccessOf(req);
      const id = await db.transaction(async (trx) => {
        const [row] = await trx('change_requests')
          .insert({ site_id: access.id, requested_by: req.currentUser!.id, ...input })
          .returning<{ id: string }[]>('id');
        await recordAuditEntry(trx, {
          ...actorOf(req),
          action: 'change_request.created',
          entityType: 'change_request',
          entityId: row!.id,
          organisationId: access.installerId,
          summary: `Change requested: ${input.subject}`,
        });
        return row!.id;
      });
      const installer = await db('organisations as o')
        .join('sites as s', 's.installer_id', 'o.id')
        .where('s.id', access.id)
        .first<{ email: string | null; site_name: string; reference: string }>(
          'o.email',
          's.name as site_name',
          's.reference',
        );
      if (installer?.email) {
        // The request is saved either way; the e-mail is a courtesy to the office.
        await deps.mailer
          .send({
            to: installer.email,
            subject: `Change requested for ${installer.reference} ${installer.site_name}`,
            text: `${req.currentUser!.displayName} asks: ${input.subject}\n\n${input.details}\n\nSee it in Wardbook: ${deps.appUrl}/office/sites/${access.id}/people`,
          })
          .catch(() => undefined);
      }
      const [created] = await query(access.id).where('r.id', id);
      res.status(201).json(toChangeRequest(created!));
    },
  );

  router.patch(
    '/api/sites/:siteId/change-requests/:requestId',
    requireSiteRelation(db, ...STAFF_WRITERS),
    async function changeRequestUpdate(req, res) {
      const { requestId } = parseRequest(requestParams, req.params, 'params');
      const { status } = parseRequest(updateChangeRequestSchema, req.body, 'body');
      const access = siteAccessOf(req);
      await db.transaction(async (trx) => {
        const updated = await trx('change_requests')
          .where({ site_id: access.id, id: requestId })
          .update({ status, updated_at: trx.fn.now() });
        if (!updated) throw new NotFoundError();
        await recordAuditEntry(trx, {
          ...actorOf(req),
          action: 'change_request.updated',
          entityType: 'change_request',
          entityId: requestId,
          organisationId: access.installerId,
          summary: `Marked a change request ${status}`,
          changes: { status: { to: status } },
        });
      });
      const [row] = await query(access.id).where('r.id', requestId);
      res.json(toChangeRequest(row!));
    },
  );

  return router;
}
