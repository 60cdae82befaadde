import express, { Router, type Response } from 'express';
import type { Knex } from 'knex';
import { actorOf } from '../audit/actor';
import { currentUser } from '../auth/current-user';
import { ForbiddenError, NotFoundError, ValidationError } from '../http/errors';
import { organisationIdsFor, requireRole, requireSignedIn } from '../http/guards';
import { parseRequest } from '../http/validate';
import { relationsToSite, requireSiteRelation, siteAccessOf, STAFF_WRITERS } from '../sites/access';
import { z } from 'zod';
import {
  customerSignatureInputSchema,
  engineerSignatureInputSchema,
  packNumberSchema,
  packSettingsInputSchema,
  revokeInputSchema,
  signingRequestInputSchema,
  variationsInputSchema,
} from './schema';
import { toPackSummary } from './repository';
import {
  buildFor,
  checkPdf,
  clearSignatures,
  documentsFor,
  findPack,
  handoverState,
  packSettings,
  previewPdf,
  publishedSealKeys,
  requestIssue,
  revokePack,
  rotateSealKey,
  savePackPrefix,
  saveVariations,
  sendSigningRequest,
  signAsEngineer,
  signFromRequest,
  signingRequestFor,
  signInPerson,
  verification,
  type HandoverDeps,
} from './service';

/** A pack is at most a few megabytes; anything far larger is not one of ours. */
const MAX_UPLOAD_BYTES = 25 * 1024 * 1024;

function sendPdf(
  res: Response,
  pdf: Buffer,
  filename: string,
  disposition: 'inline' | 'attachment',
) {
  res
    .type('application/pdf')
    .set('Content-Disposition', `${disposition}; filename="${filename}"`)
    .set('Cache-Control', 'private, no-store')
    // The handover page shows the preview in a frame of its own origin.
    .set('Content-Security-Policy', "default-src 'none'; frame-ancestors 'self'")
    .send(pdf);
}

const packParams = z.object({ packNumber: packNumberSchema });
const packNumberOf = (params: unknown) => {
  const parsed = packParams.safeParse(params);
  // A malformed number cannot name a pack: the same answer as an unknown one.
  if (!parsed.success) throw new NotFoundError('No handover pack has that number.');
  return parsed.data.packNumber;
};

/**
 * The public side of packs: verification by number, the byte-for-byte check of a copy, and the
 * published seal keys. No sign-in, no session, no CSRF token: nothing here changes anything.
 */
export function createVerifyRouter({ db }: { db: Knex }): Router {
  const router = Router();

  router.get('/api/verify/:packNumber', async function verifyPack(req, res) {
    res.set('Cache-Control', 'no-cache').json(await verification(db, packNumberOf(req.params)));
  });

  router.post(
    '/api/verify/:packNumber/check',
    express.raw({ type: () => true, limit: MAX_UPLOAD_BYTES }),
    async function checkCopy(req, res) {
      const packNumber = packNumberOf(req.params);
      const bytes = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
      if (bytes.length === 0) {
        throw new ValidationError(
          [{ path: 'body', message: 'Choose the PDF file to check.' }],
          'No file was uploaded.',
        );
      }
      res.json(await checkPdf(db, packNumber, bytes));
    },
  );

  router.get('/api/seal-keys', async function sealKeys(_req, res) {
    res.json({ keys: await publishedSealKeys(db) });
  });

  return router;
}

export function createHandoverRouter(deps: HandoverDeps): Router {
  const { db } = deps;
  const router = Router();
  const installerStaff = requireSiteRelation(db, ...STAFF_WRITERS);
  const engineerOnly = requireSiteRelation(db, 'engineer');
  const state = async (req: Parameters<typeof siteAccessOf>[0]) =>
    handoverState(deps, siteAccessOf(req));

  router.get('/api/sites/:siteId/handover', installerStaff, async function handover(req, res) {
    res.json(await state(req));
  });

  router.put(
    '/api/sites/:siteId/handover/variations',
    installerStaff,
    async function variations(req, res) {
      const input = parseRequest(variationsInputSchema, req.body, 'body');
      await saveVariations(db, siteAccessOf(req), input, actorOf(req));
      res.json(await state(req));
    },
  );

  router.get(
    '/api/sites/:siteId/handover/preview.pdf',
    installerStaff,
    async function preview(req, res) {
      sendPdf(res, await previewPdf(deps, siteAccessOf(req).id), 'handover-preview.pdf', 'inline');
    },
  );

  // The engineer signs as themself; the customer signs on the engineer's device, in person.
  router.post(
    '/api/sites/:siteId/handover/signatures/engineer',
    engineerOnly,
    async function engineerSigns(req, res) {
      const { image } = parseRequest(engineerSignatureInputSchema, req.body, 'body');
      const user = currentUser(req);
      await signAsEngineer(db, siteAccessOf(req), image, user, actorOf(req));
      res.status(201).json(await state(req));
    },
  );

  router.post(
    '/api/sites/:siteId/handover/signatures/customer',
    engineerOnly,
    async function customerSigns(req, res) {
      const input = parseRequest(customerSignatureInputSchema, req.body, 'body');
      await signInPerson(db, siteAccessOf(req), input, actorOf(req));
      res.status(201).json(await state(req));
    },
  );

  router.delete(
    '/api/sites/:siteId/handover/signatures',
    installerStaff,
    async function clear(req, res) {
      await clearSignatures(db, siteAccessOf(req), actorOf(req));
      res.json(await state(req));
    },
  );

  router.post(
    '/api/sites/:siteId/handover/signing-request',
    installerStaff,
    async function signingRequest(req, res) {
      const { homeownerUserId } = parseRequest(signingRequestInputSchema, req.body, 'body');
      await sendSigningRequest(deps, siteAccessOf(req), homeownerUserId, actorOf(req));
      res.status(201).json(await state(req));
    },
  );

  router.post('/api/sites/:siteId/handover/issue', engineerOnly, async function issue(req, res) {
    const build = await requestIssue(deps, siteAccessOf(req), actorOf(req));
    res.status(202).json({ build });
  });

  router.get(
    '/api/handover-builds/:buildId',
    requireRole('engineer', 'office'),
    async function build(req, res) {
      const user = currentUser(req);
      const mayRead = async (siteId: string) => {
        const access = await relationsToSite(db, user, siteId);
        return Boolean(access?.relations.some((relation) => STAFF_WRITERS.includes(relation)));
      };
      res.json({ build: await buildFor(db, mayRead, String(req.params.buildId)) });
    },
  );

  // The issued PDF: the installer's staff and the site's homeowners.
  router.get('/api/packs/:packNumber/pdf', requireSignedIn, async function download(req, res) {
    const pack = await findPack(db, packNumberOf(req.params));
    const access = pack ? await relationsToSite(db, currentUser(req), pack.site_id) : undefined;
    if (!pack || !access || access.relations.length === 0)
      throw new NotFoundError('No handover pack has that number.');
    // A keyholder or the monitoring centre knows the site but does not hold its papers.
    if (
      !access.relations.some((relation) => ['engineer', 'office', 'homeowner'].includes(relation))
    )
      throw new ForbiddenError('The handover pack is for the installer and the homeowner.');
    const stream = await deps.storage.open(pack.pdf_key);
    if (!stream) throw new NotFoundError('The pack’s file is missing; tell your installer.');
    res
      .type('application/pdf')
      .set('Content-Disposition', `attachment; filename="${pack.pack_number}.pdf"`)
      .set('Content-Length', String(pack.size_bytes))
      .set('Cache-Control', 'private, no-store');
    stream.pipe(res);
  });

  router.post(
    '/api/packs/:packNumber/revoke',
    requireRole('office'),
    async function revoke(req, res) {
      const packNumber = packNumberOf(req.params);
      const { reason } = parseRequest(revokeInputSchema, req.body, 'body');
      const offices = organisationIdsFor(currentUser(req), ['office']);
      const pack = await findPack(db, packNumber);
      if (!pack || !offices.includes(pack.organisation_id)) throw new NotFoundError();
      const revoked = await revokePack(db, pack.organisation_id, packNumber, reason, actorOf(req));
      res.json(toPackSummary(revoked, deps.publicUrl));
    },
  );

  // --- The homeowner ---------------------------------------------------------------------------
  router.get('/api/my/documents', requireRole('homeowner'), async function documents(req, res) {
    res.json({ packs: await documentsFor(db, currentUser(req).id, deps.publicUrl) });
  });

  router.get(
    '/api/my/signing-requests/:requestId',
    requireRole('homeowner'),
    async function signingRequest(req, res) {
      const { siteId: _siteId, ...request } = await signingRequestFor(
        db,
        currentUser(req).id,
        String(req.params.requestId),
      );
      res.json(request);
    },
  );

  router.get(
    '/api/my/signing-requests/:requestId/preview.pdf',
    requireRole('homeowner'),
    async function signingPreview(req, res) {
      const request = await signingRequestFor(
        db,
        currentUser(req).id,
        String(req.params.requestId),
      );
      sendPdf(res, await previewPdf(deps, request.siteId), 'handover-preview.pdf', 'inline');
    },
  );

  router.post(
    '/api/my/signing-requests/:requestId/sign',
    requireRole('homeowner'),
    async function sign(req, res) {
      const input = parseRequest(customerSignatureInputSchema, req.body, 'body');
      const user = currentUser(req);
      const requestId = String(req.params.requestId);
      await signFromRequest(db, user, requestId, input, actorOf(req));
      const { siteId: _siteId, ...request } = await signingRequestFor(db, user.id, requestId);
      res.status(201).json(request);
    },
  );

  // --- The office: numbering and the sealing key ------------------------------------------------
  const officeOrganisation = (req: Parameters<typeof currentUser>[0]) => {
    const [organisationId] = organisationIdsFor(currentUser(req), ['office']);
    if (!organisationId) throw new NotFoundError();
    return organisationId;
  };

  router.get(
    '/api/organisation/pack-settings',
    requireRole('office'),
    async function settings(req, res) {
      res.json(await packSettings(db, officeOrganisation(req), deps.sealKeySecret));
    },
  );

  router.put(
    '/api/organisation/pack-settings',
    requireRole('office'),
    async function saveSettings(req, res) {
      const { prefix } = parseRequest(packSettingsInputSchema, req.body, 'body');
      const organisationId = officeOrganisation(req);
      await savePackPrefix(db, organisationId, prefix, actorOf(req));
      res.json(await packSettings(db, organisationId, deps.sealKeySecret));
    },
  );

  router.post(
    '/api/organisation/seal-keys/rotate',
    requireRole('office'),
    async function rotate(req, res) {
      const organisationId = officeOrganisation(req);
      await rotateSealKey(db, organisationId, deps.sealKeySecret, actorOf(req));
      res.json(await packSettings(db, organisationId, deps.sealKeySecret));
    },
  );

  return router;
}
