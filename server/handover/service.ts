import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { z } from 'zod';
import { recordAuditEntry } from '../audit/repository';
import type { AuditEntryInput } from '../audit/repository';
import { preIssueCheck } from '../commissioning/service';
import type { FileStorage } from '../files/storage';
import { ConflictError, NotFoundError, ValidationError } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import type { SiteAccess } from '../sites/access';
import type { PackBuildQueue } from './build-queue';
import { collectPackSnapshot } from './collect';
import { renderPackPdfOffThread as renderPackPdf } from './pdf/render-off-thread';
import {
  ensureDraft,
  findPack,
  listSitePacks,
  packsQuery,
  packStatus,
  toPackSummary,
  type DraftRow,
  type PackListRow,
} from './repository';
import {
  BUILD_STAGES,
  type customerSignatureInputSchema,
  type HandoverDraft,
  type HandoverState,
  type PackBuild,
  type PackSettings,
  type PdfCheck,
  type SigningRequest,
  type Verification,
} from './schema';
import {
  generateSealKey,
  keyFingerprint,
  sealText,
  sha256Hex,
  signSealText,
  verifySealText,
} from './seal';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;

export interface HandoverDeps {
  db: Knex;
  storage: FileStorage;
  mailer: Mailer;
  logger: Logger;
  /** The app's public origin, for verification links and QR codes. */
  publicUrl: string;
  sealKeySecret: string;
  /** Builds packs off the request path; without one (bench, scripts) the build runs at once. */
  buildQueue?: PackBuildQueue;
}

const PNG_MAGIC = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** The schema checked the data URL's shape; this checks the bytes really are a PNG. */
function assertPng(image: string, path = 'body.image') {
  const bytes = Buffer.from(image.slice(image.indexOf(',') + 1), 'base64');
  if (bytes.length < 64 || !bytes.subarray(0, 8).equals(PNG_MAGIC)) {
    throw new ValidationError([
      { path, message: 'The signature must be a PNG image drawn on the signing pad.' },
    ]);
  }
}

// --- The draft and its state -----------------------------------------------------------------

function toDraft(
  row: DraftRow,
  request: SigningRequestRow | undefined,
  build: BuildRow | undefined,
): HandoverDraft {
  return {
    id: row.id,
    variations: row.variations,
    engineerSignature:
      row.engineer_signed_at && row.engineer_name
        ? { name: row.engineer_name, signedAt: row.engineer_signed_at.toISOString() }
        : null,
    customerSignature:
      row.customer_signed_at && row.customer_name && row.customer_signed_via
        ? {
            name: row.customer_name,
            signedAt: row.customer_signed_at.toISOString(),
            via: row.customer_signed_via,
          }
        : null,
    signingRequest: request
      ? {
          id: request.id,
          sentTo: request.sent_to,
          sentAt: request.sent_at.toISOString(),
          signed: request.signed_at !== null,
        }
      : null,
    build: build ? toBuild(build) : null,
    version: row.version,
  };
}

interface SigningRequestRow {
  id: string;
  draft_id: string;
  homeowner_user_id: string;
  sent_to: string;
  sent_at: Date;
  signed_at: Date | null;
  withdrawn_at: Date | null;
}

interface BuildRow {
  id: string;
  site_id: string;
  draft_id: string | null;
  draft_version: number;
  status: PackBuild['status'];
  stage: PackBuild['stage'];
  pack_id: string | null;
  error: string | null;
  requested_by: string | null;
  pack_number?: string | null;
}

function toBuild(row: BuildRow): PackBuild {
  const index = BUILD_STAGES.indexOf(row.stage);
  return {
    id: row.id,
    status: row.status,
    stage: row.stage,
    percent: row.status === 'done' ? 100 : Math.round((index / (BUILD_STAGES.length - 1)) * 100),
    packNumber: row.pack_number ?? null,
    error: row.error,
  };
}

function buildQuery(db: Knex) {
  return db('pack_builds as b')
    .leftJoin('handover_packs as p', 'p.id', 'b.pack_id')
    .select('b.*', 'p.pack_number');
}

async function siteHomeowners(db: Knex, siteId: string) {
  return db('site_homeowners as h')
    .join('users as u', 'u.id', 'h.user_id')
    .where('h.site_id', siteId)
    .orderBy('u.display_name')
    .select('u.id', 'u.display_name as name', 'u.email');
}

interface Readiness {
  blocking: string[];
  waitingFor: string[];
  canIssue: boolean;
}

async function readiness(db: Knex, access: SiteAccess, draft: DraftRow, build?: BuildRow) {
  const [check, organisation] = await Promise.all([
    preIssueCheck(db, access.id),
    db('organisations').where({ id: access.installerId }).first('pack_prefix'),
  ]);
  const blocking = check.problems
    .filter((problem) => problem.severity === 'blocking')
    .map((problem) => problem.message);
  const waitingFor: string[] = [];
  if (blocking.length > draft.variations.length) {
    const missing = blocking.length - draft.variations.length;
    waitingFor.push(
      `${missing} blocking ${missing === 1 ? 'problem' : 'problems'} from the pre-issue check ${missing === 1 ? 'has' : 'have'} no written variation: put ${missing === 1 ? 'it' : 'them'} right, or write each down for the customer to accept.`,
    );
  }
  if (!draft.engineer_signed_at) waitingFor.push('The engineer has not signed.');
  if (!draft.customer_signed_at) waitingFor.push('The customer has not signed.');
  if (!organisation?.pack_prefix)
    waitingFor.push('The office has not set the pack number prefix yet.');
  if (build && (build.status === 'queued' || build.status === 'running'))
    waitingFor.push('A pack is being built now.');
  return { blocking, waitingFor, canIssue: waitingFor.length === 0 } satisfies Readiness;
}

async function currentRequest(db: Knex, draftId: string) {
  return db<SigningRequestRow>('signing_requests')
    .where({ draft_id: draftId })
    .whereNull('withdrawn_at')
    .orderBy('sent_at', 'desc')
    .first();
}

async function latestBuild(db: Knex, siteId: string): Promise<BuildRow | undefined> {
  return buildQuery(db).where('b.site_id', siteId).orderBy('b.created_at', 'desc').first();
}

export async function handoverState(
  deps: Pick<HandoverDeps, 'db' | 'publicUrl'>,
  access: SiteAccess,
): Promise<HandoverState> {
  const { db } = deps;
  const draft = await ensureDraft(db, access.id);
  const [request, build, packs, homeowners] = await Promise.all([
    currentRequest(db, draft.id),
    latestBuild(db, access.id),
    listSitePacks(db, access.id),
    siteHomeowners(db, access.id),
  ]);
  const ready = await readiness(db, access, draft, build);
  return {
    draft: toDraft(draft, request, build),
    packs: packs.map((row) => toPackSummary(row, deps.publicUrl)),
    homeowners,
    ...ready,
  };
}

async function lockDraft(trx: Knex.Transaction, siteId: string): Promise<DraftRow> {
  await ensureDraft(trx, siteId);
  return trx('handover_drafts').where({ site_id: siteId }).forUpdate().first();
}

/**
 * Closes the draft's open signing requests: the unsigned ones when what the customer would sign
 * has changed, or all of them when the signatures are cleared and signing starts again.
 */
async function withdrawRequests(trx: Knex, draftId: string, which: 'unsigned' | 'all') {
  await trx('signing_requests')
    .where({ draft_id: draftId })
    .whereNull('withdrawn_at')
    .modify((query) => {
      if (which === 'unsigned') query.whereNull('signed_at');
    })
    .update({ withdrawn_at: trx.fn.now() });
}

const CLEARED_CUSTOMER = {
  customer_signature: null,
  customer_name: null,
  customer_user_id: null,
  customer_signed_via: null,
  customer_signed_at: null,
};

export async function saveVariations(
  db: Knex,
  access: SiteAccess,
  input: { variations: string[]; version: number | null },
  actor: Actor,
) {
  await db.transaction(async (trx) => {
    const draft = await lockDraft(trx, access.id);
    if (input.version !== null && input.version !== draft.version) {
      throw new ConflictError(
        'Someone else changed this handover since you opened it. Reload to see their changes, then make yours again.',
      );
    }
    const next = input.variations.map((text) => ({ text }));
    const changed = JSON.stringify(next) !== JSON.stringify(draft.variations);
    if (!changed) return;
    // The customer accepted the list they saw; a different list needs their signature again.
    await trx('handover_drafts')
      .where({ id: draft.id })
      .update({
        variations: JSON.stringify(next),
        ...CLEARED_CUSTOMER,
        version: draft.version + 1,
        updated_at: trx.fn.now(),
      });
    await withdrawRequests(trx, draft.id, 'unsigned');
    await recordAuditEntry(trx, {
      ...actor,
      action: 'handover.variations_changed',
      entityType: 'site',
      entityId: access.id,
      organisationId: access.installerId,
      summary: `Handover variations changed (${next.length})`,
    });
  });
}

export async function signAsEngineer(
  db: Knex,
  access: SiteAccess,
  image: string,
  user: { id: string; displayName: string },
  actor: Actor,
) {
  assertPng(image);
  await db.transaction(async (trx) => {
    const draft = await lockDraft(trx, access.id);
    if (draft.engineer_signed_at) {
      throw new ConflictError(
        `${draft.engineer_name ?? 'The engineer'} has already signed this handover. Clear the signatures to sign again.`,
      );
    }
    await trx('handover_drafts')
      .where({ id: draft.id })
      .update({
        engineer_signature: image,
        engineer_user_id: user.id,
        engineer_name: user.displayName,
        engineer_signed_at: trx.fn.now(),
        version: draft.version + 1,
        updated_at: trx.fn.now(),
      });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'handover.engineer_signed',
      entityType: 'site',
      entityId: access.id,
      organisationId: access.installerId,
      summary: `${user.displayName} signed the handover`,
    });
  });
}

async function recordCustomerSignature(
  trx: Knex.Transaction,
  draft: DraftRow,
  values: { name: string; image: string; userId: string | null; via: 'in_person' | 'request' },
) {
  if (draft.customer_signed_at) {
    throw new ConflictError(
      `${draft.customer_name ?? 'The customer'} has already signed this handover.`,
    );
  }
  await trx('handover_drafts')
    .where({ id: draft.id })
    .update({
      customer_signature: values.image,
      customer_name: values.name,
      customer_user_id: values.userId,
      customer_signed_via: values.via,
      customer_signed_at: trx.fn.now(),
      version: draft.version + 1,
      updated_at: trx.fn.now(),
    });
}

export async function signInPerson(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof customerSignatureInputSchema>,
  actor: Actor,
) {
  assertPng(input.image);
  await db.transaction(async (trx) => {
    const draft = await lockDraft(trx, access.id);
    await recordCustomerSignature(trx, draft, { ...input, userId: null, via: 'in_person' });
    await withdrawRequests(trx, draft.id, 'unsigned');
    await recordAuditEntry(trx, {
      ...actor,
      action: 'handover.customer_signed',
      entityType: 'site',
      entityId: access.id,
      organisationId: access.installerId,
      summary: `${input.name} signed the handover in person`,
    });
  });
}

export async function clearSignatures(db: Knex, access: SiteAccess, actor: Actor) {
  await db.transaction(async (trx) => {
    const draft = await lockDraft(trx, access.id);
    await trx('handover_drafts')
      .where({ id: draft.id })
      .update({
        engineer_signature: null,
        engineer_user_id: null,
        engineer_name: null,
        engineer_signed_at: null,
        ...CLEARED_CUSTOMER,
        version: draft.version + 1,
        updated_at: trx.fn.now(),
      });
    await withdrawRequests(trx, draft.id, 'all');
    await recordAuditEntry(trx, {
      ...actor,
      action: 'handover.signatures_cleared',
      entityType: 'site',
      entityId: access.id,
      organisationId: access.installerId,
      summary: 'Handover signatures cleared',
    });
  });
}

// --- Signing requests for the homeowner --------------------------------------------------------

export async function sendSigningRequest(
  deps: Pick<HandoverDeps, 'db' | 'mailer' | 'publicUrl'>,
  access: SiteAccess,
  homeownerUserId: string,
  actor: Actor,
) {
  const { db } = deps;
  const homeowner = (await siteHomeowners(db, access.id)).find(
    (person) => person.id === homeownerUserId,
  );
  if (!homeowner) {
    throw new ValidationError([
      { path: 'body.homeownerUserId', message: 'Choose one of this site’s homeowners.' },
    ]);
  }
  const site = await db('sites').where({ id: access.id }).first('name', 'reference');
  const request = await db.transaction(async (trx) => {
    const draft = await lockDraft(trx, access.id);
    if (draft.customer_signed_at)
      throw new ConflictError(`${draft.customer_name ?? 'The customer'} has already signed.`);
    await withdrawRequests(trx, draft.id, 'unsigned');
    const [row] = await trx('signing_requests')
      .insert({
        draft_id: draft.id,
        homeowner_user_id: homeowner.id,
        sent_to: homeowner.email,
        sent_by: actor.actorUserId,
      })
      .returning('*');
    await recordAuditEntry(trx, {
      ...actor,
      action: 'handover.signing_requested',
      entityType: 'site',
      entityId: access.id,
      organisationId: access.installerId,
      summary: `Signing request sent to ${homeowner.name}`,
    });
    return row as SigningRequestRow;
  });
  const link = `${deps.publicUrl}/homeowner/sign/${request.id}`;
  await deps.mailer.send({
    to: homeowner.email,
    subject: `Please countersign the handover of ${site.name}`,
    text: [
      `Hello ${homeowner.name},`,
      '',
      `Your alarm engineer has finished commissioning the system at ${site.name} (${site.reference}) and asks you to countersign the handover.`,
      'Sign in to Wardbook with this link, read the pack preview and any variations, and sign on your screen:',
      '',
      link,
      '',
      'If you were not expecting this, ignore this e-mail and call your installer.',
    ].join('\n'),
  });
}

async function findRequestFor(db: Knex, userId: string, requestId: string) {
  if (!/^[0-9a-f-]{36}$/i.test(requestId)) throw new NotFoundError();
  const request = await db<SigningRequestRow>('signing_requests')
    .where({ id: requestId, homeowner_user_id: userId })
    .whereNull('withdrawn_at')
    .first();
  // Someone else's request, or one withdrawn: the same answer, so neither is confirmed to exist.
  if (!request) throw new NotFoundError('This signing request is not open to you any more.');
  return request;
}

export async function signingRequestFor(
  db: Knex,
  userId: string,
  requestId: string,
): Promise<SigningRequest & { siteId: string }> {
  const request = await findRequestFor(db, userId, requestId);
  const draft: DraftRow & { site_name: string } = await db('handover_drafts as d')
    .join('sites as s', 's.id', 'd.site_id')
    .where('d.id', request.draft_id)
    .first('d.*', 's.name as site_name');
  return {
    id: request.id,
    siteId: draft.site_id,
    siteName: draft.site_name,
    engineerName: draft.engineer_name,
    variations: draft.variations,
    signed: request.signed_at !== null,
    previewUrl: `/api/my/signing-requests/${request.id}/preview.pdf`,
  };
}

export async function signFromRequest(
  db: Knex,
  user: { id: string },
  requestId: string,
  input: z.output<typeof customerSignatureInputSchema>,
  actor: Actor,
) {
  assertPng(input.image);
  const request = await findRequestFor(db, user.id, requestId);
  if (request.signed_at) throw new ConflictError('You have already signed this handover.');
  await db.transaction(async (trx) => {
    const draft: DraftRow = await trx('handover_drafts')
      .where({ id: request.draft_id })
      .forUpdate()
      .first();
    await recordCustomerSignature(trx, draft, {
      ...input,
      userId: user.id,
      via: 'request',
    });
    await trx('signing_requests').where({ id: request.id }).update({ signed_at: trx.fn.now() });
    const site = await trx('sites').where({ id: draft.site_id }).first('installer_id');
    await recordAuditEntry(trx, {
      ...actor,
      action: 'handover.customer_signed',
      entityType: 'site',
      entityId: draft.site_id,
      organisationId: site.installer_id,
      summary: `${input.name} signed the handover from a signing request`,
    });
  });
}

// --- Seal keys and numbering ---------------------------------------------------------------------

interface SealKeyRow {
  id: string;
  organisation_id: string;
  public_key: string;
  private_key_sealed: string;
  created_at: Date;
  retired_at: Date | null;
}

/** Every installer gets a sealing key at first start; a new installer gets one on first issue. */
export async function ensureSealKeys(db: Knex, secret: string, organisationId?: string) {
  const missing = await db('organisations as o')
    .where('o.kind', 'installer')
    .modify((query) => {
      if (organisationId) query.where('o.id', organisationId);
    })
    .whereNotExists(
      db('seal_keys as k').whereRaw('k.organisation_id = o.id').whereNull('k.retired_at'),
    )
    .pluck('o.id');
  for (const id of missing) {
    const key = generateSealKey(secret);
    await db('seal_keys')
      .insert({
        organisation_id: id,
        public_key: key.publicKeyPem,
        private_key_sealed: key.privateKeySealed,
      })
      // Two processes starting at once: the partial unique index keeps one current key.
      .onConflict(db.raw('(organisation_id) where retired_at is null'))
      .ignore();
  }
}

function toSealKey(row: SealKeyRow & { organisation_name: string }) {
  return {
    keyId: keyFingerprint(row.public_key),
    organisation: row.organisation_name,
    publicKey: row.public_key,
    createdAt: row.created_at.toISOString(),
    retiredAt: row.retired_at ? row.retired_at.toISOString() : null,
  };
}

function sealKeysQuery(db: Knex) {
  return db('seal_keys as k')
    .join('organisations as o', 'o.id', 'k.organisation_id')
    .select('k.*', 'o.name as organisation_name')
    .orderBy([{ column: 'o.name' }, { column: 'k.created_at', order: 'desc' }]);
}

export async function publishedSealKeys(db: Knex) {
  return (await sealKeysQuery(db)).map(toSealKey);
}

export async function packSettings(
  db: Knex,
  organisationId: string,
  secret: string,
): Promise<PackSettings> {
  await ensureSealKeys(db, secret, organisationId);
  const organisation = await db('organisations')
    .where({ id: organisationId })
    .first('pack_prefix', 'pack_next_number');
  const keys = await sealKeysQuery(db).where('k.organisation_id', organisationId);
  return {
    prefix: organisation?.pack_prefix ?? '',
    nextNumber: organisation?.pack_next_number ?? 1,
    keys: keys.map(toSealKey),
  };
}

export async function savePackPrefix(
  db: Knex,
  organisationId: string,
  prefix: string,
  actor: Actor,
) {
  await db.transaction(async (trx) => {
    const before = await trx('organisations')
      .where({ id: organisationId })
      .forUpdate()
      .first('pack_prefix');
    const taken = await trx('organisations')
      .where({ pack_prefix: prefix })
      .whereNot({ id: organisationId })
      .first('id');
    if (taken) {
      throw new ValidationError([
        {
          path: 'body.prefix',
          message: `${prefix} is another company’s prefix; pack numbers must be unique. Choose other letters.`,
        },
      ]);
    }
    await trx('organisations').where({ id: organisationId }).update({ pack_prefix: prefix });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'organisation.pack_prefix_set',
      entityType: 'organisation',
      entityId: organisationId,
      organisationId,
      summary: `Pack number prefix set to ${prefix}`,
      changes: { pack_prefix: { from: before?.pack_prefix ?? null, to: prefix } },
    });
  });
}

export async function rotateSealKey(
  db: Knex,
  organisationId: string,
  secret: string,
  actor: Actor,
) {
  const key = generateSealKey(secret);
  await db.transaction(async (trx) => {
    await trx('organisations').where({ id: organisationId }).forUpdate().first('id');
    // The old key is retired, never deleted: packs sealed with it must still verify.
    await trx('seal_keys')
      .where({ organisation_id: organisationId })
      .whereNull('retired_at')
      .update({ retired_at: trx.fn.now() });
    await trx('seal_keys').insert({
      organisation_id: organisationId,
      public_key: key.publicKeyPem,
      private_key_sealed: key.privateKeySealed,
    });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'organisation.seal_key_rotated',
      entityType: 'organisation',
      entityId: organisationId,
      organisationId,
      summary: `Sealing key rotated; new key ${keyFingerprint(key.publicKeyPem)}`,
    });
  });
}

// --- Preview, issue and the build ------------------------------------------------------------------

function signatureOf(draft: DraftRow, who: 'engineer' | 'customer') {
  const image = who === 'engineer' ? draft.engineer_signature : draft.customer_signature;
  const name = who === 'engineer' ? draft.engineer_name : draft.customer_name;
  const at = who === 'engineer' ? draft.engineer_signed_at : draft.customer_signed_at;
  return image && name && at ? { name, image, signedAt: at.toISOString() } : null;
}

function acceptedVariations(draft: DraftRow) {
  const acceptedAt = draft.customer_signed_at?.toISOString() ?? null;
  return draft.variations.map((variation) => ({ text: variation.text, acceptedAt }));
}

export async function previewPdf(
  deps: Pick<HandoverDeps, 'db' | 'publicUrl'>,
  siteId: string,
): Promise<Buffer> {
  const draft = await ensureDraft(deps.db, siteId);
  const snapshot = await collectPackSnapshot(deps.db, siteId, {
    packNumber: 'PREVIEW',
    revision: 1,
    supersedes: null,
    issuedAt: new Date(),
    preview: true,
    verifyUrl: `${deps.publicUrl}/verify`,
    variations: acceptedVariations(draft),
    engineer: signatureOf(draft, 'engineer'),
    customer: signatureOf(draft, 'customer'),
  });
  return renderPackPdf(snapshot);
}

export async function requestIssue(
  deps: HandoverDeps,
  access: SiteAccess,
  actor: Actor,
): Promise<PackBuild> {
  const { db } = deps;
  const build = await db.transaction(async (trx) => {
    const draft = await lockDraft(trx, access.id);
    const running = await trx('pack_builds')
      .where({ site_id: access.id })
      .whereIn('status', ['queued', 'running'])
      .first('id');
    if (running) throw new ConflictError('A pack for this site is being built already.');
    const ready = await readiness(trx, access, draft);
    if (!ready.canIssue) {
      throw new ConflictError(`The pack cannot be issued yet: ${ready.waitingFor.join(' ')}`);
    }
    const [row] = await trx('pack_builds')
      .insert({
        site_id: access.id,
        draft_id: draft.id,
        draft_version: draft.version,
        requested_by: actor.actorUserId,
      })
      .returning('*');
    return row as BuildRow;
  });
  if (deps.buildQueue) await deps.buildQueue.enqueue(build.id);
  else await runPackBuild(deps, build.id);
  return toBuild((await buildQuery(db).where('b.id', build.id).first()) ?? build);
}

async function setStage(db: Knex, buildId: string, stage: PackBuild['stage']) {
  await db('pack_builds')
    .where({ id: buildId })
    .update({ stage, status: stage === 'done' ? 'done' : 'running', updated_at: db.fn.now() });
}

/**
 * Issues the pack for one build: number, snapshot, PDF, hash, seal and the stored row, all in
 * one transaction holding the installer's row, so the sequence has no gaps and no number is
 * used twice. The e-mail to the homeowner goes after commit.
 */
export async function runPackBuild(deps: HandoverDeps, buildId: string): Promise<void> {
  const { db } = deps;
  const build: BuildRow | undefined = await db('pack_builds').where({ id: buildId }).first();
  if (!build || build.status === 'done' || build.status === 'failed') return;
  let pdfKey: string | null = null;
  try {
    await setStage(db, buildId, 'collecting');
    const pack = await db.transaction(async (trx) => {
      const site = await trx('sites').where({ id: build.site_id }).first('installer_id');
      const organisation = await trx('organisations')
        .where({ id: site.installer_id })
        .forUpdate()
        .first('id', 'pack_prefix', 'pack_next_number');
      const draft: DraftRow = await trx('handover_drafts')
        .where({ id: build.draft_id })
        .forUpdate()
        .first();
      if (!draft || draft.version !== build.draft_version) {
        throw new ConflictError('The handover changed after issue was asked for; issue it again.');
      }
      const engineer = signatureOf(draft, 'engineer');
      const customer = signatureOf(draft, 'customer');
      if (!engineer || !customer) throw new ConflictError('Both signatures are needed.');
      if (!organisation.pack_prefix)
        throw new ConflictError('The office has not set the pack number prefix yet.');

      const current: PackListRow | undefined = await packsQuery(trx)
        .where('p.site_id', build.site_id)
        .whereNull('next.id')
        .whereNull('r.pack_id')
        .orderBy('p.issued_at', 'desc')
        .first();
      let serial: number;
      let revision: number;
      let prefix: string;
      if (current) {
        // A correction: same number, next revision, superseding the one in force.
        serial = current.serial;
        revision = current.revision + 1;
        prefix = current.pack_number.split('-')[0]!;
      } else {
        serial = organisation.pack_next_number;
        revision = 1;
        prefix = organisation.pack_prefix;
        await trx('organisations')
          .where({ id: organisation.id })
          .update({ pack_next_number: serial + 1 });
      }
      const packNumber = `${prefix}-${String(serial).padStart(6, '0')}-R${revision}`;
      const issuedAt = new Date();
      const snapshot = await collectPackSnapshot(trx, build.site_id, {
        packNumber,
        revision,
        supersedes: current?.pack_number ?? null,
        issuedAt,
        preview: false,
        verifyUrl: `${deps.publicUrl}/verify/${packNumber}`,
        variations: acceptedVariations(draft),
        engineer,
        customer,
      });
      await setStage(db, buildId, 'rendering');
      const pdf = await renderPackPdf(snapshot);
      await setStage(db, buildId, 'sealing');
      const sha256 = sha256Hex(pdf);
      await ensureSealKeys(trx, deps.sealKeySecret, organisation.id);
      const key: SealKeyRow = await trx('seal_keys')
        .where({ organisation_id: organisation.id })
        .whereNull('retired_at')
        .first();
      const text = sealText({ packNumber, issuedAt, sha256 });
      const seal = signSealText(text, key.private_key_sealed, deps.sealKeySecret);
      // The row can never be updated, so the PDF is stored first under the pack's own id.
      const packId = randomUUID();
      pdfKey = `packs/${organisation.id}/${packId}`;
      await deps.storage.put(pdfKey, pdf);
      await trx('handover_packs').insert({
        id: packId,
        site_id: build.site_id,
        organisation_id: organisation.id,
        pack_number: packNumber,
        serial,
        revision,
        supersedes_id: current?.id ?? null,
        snapshot: JSON.stringify(snapshot),
        pdf_key: pdfKey,
        sha256,
        size_bytes: pdf.length,
        seal_key_id: key.id,
        sealed_text: text,
        seal,
        issued_at: issuedAt,
        issued_by: draft.engineer_user_id,
        issued_by_name: engineer.name,
      });
      await trx('pack_builds')
        .where({ id: buildId })
        .update({ pack_id: packId, stage: 'sending', updated_at: trx.fn.now() });
      // The signed draft is used up; a correction starts a fresh one.
      await trx('handover_drafts').where({ id: draft.id }).delete();
      await recordAuditEntry(trx, {
        actorUserId: build.requested_by,
        action: 'handover.pack_issued',
        entityType: 'site',
        entityId: build.site_id,
        organisationId: organisation.id,
        summary: `Handover pack ${packNumber} issued${current ? `, superseding ${current.pack_number}` : ''}`,
      });
      return { packNumber, pdf, siteId: build.site_id };
    });
    pdfKey = null;
    await emailPack(deps, pack).catch((error: unknown) =>
      deps.logger.error({ err: error, packNumber: pack.packNumber }, 'pack e-mail failed'),
    );
    await setStage(db, buildId, 'done');
  } catch (error) {
    // A PDF stored for a pack that was then not issued is not kept.
    if (pdfKey) await deps.storage.remove(pdfKey).catch(() => undefined);
    await failBuild(deps, buildId, error);
  }
}

async function emailPack(
  deps: HandoverDeps,
  pack: { packNumber: string; pdf: Buffer; siteId: string },
) {
  const site = await deps.db('sites').where({ id: pack.siteId }).first('name', 'reference');
  const homeowners = await siteHomeowners(deps.db, pack.siteId);
  for (const homeowner of homeowners) {
    await deps.mailer.send({
      to: homeowner.email,
      subject: `Your handover pack ${pack.packNumber} for ${site.name}`,
      text: [
        `Hello ${homeowner.name},`,
        '',
        `Your alarm system at ${site.name} (${site.reference}) has been handed over. The signed handover pack ${pack.packNumber} is attached.`,
        'Keep it with your home’s papers: your insurer may ask for it.',
        '',
        `Anyone can check that a copy is genuine and unaltered at ${deps.publicUrl}/verify/${pack.packNumber}`,
        'You can also download it again from Documents when you sign in to Wardbook.',
      ].join('\n'),
      attachments: [
        { filename: `${pack.packNumber}.pdf`, content: pack.pdf, contentType: 'application/pdf' },
      ],
    });
  }
}

async function failBuild(deps: HandoverDeps, buildId: string, error: unknown) {
  deps.logger.error({ err: error, buildId }, 'pack build failed');
  const message =
    error instanceof ConflictError || error instanceof NotFoundError
      ? error.message
      : 'The pack could not be built. Nothing was issued; try again, and tell support if it happens again.';
  await deps
    .db('pack_builds')
    .where({ id: buildId })
    .update({ status: 'failed', error: message, updated_at: deps.db.fn.now() });
}

// --- Reading issued packs ------------------------------------------------------------------------

export async function buildFor(
  db: Knex,
  siteIds: (siteId: string) => Promise<boolean>,
  buildId: string,
) {
  if (!/^[0-9a-f-]{36}$/i.test(buildId)) throw new NotFoundError();
  const row: BuildRow | undefined = await buildQuery(db).where('b.id', buildId).first();
  if (!row || !(await siteIds(row.site_id))) throw new NotFoundError();
  return toBuild(row);
}

export async function documentsFor(db: Knex, userId: string, publicUrl: string) {
  const rows: PackListRow[] = await packsQuery(db)
    .whereExists(
      db('site_homeowners as h').whereRaw('h.site_id = p.site_id').where('h.user_id', userId),
    )
    .orderBy([
      { column: 's.name' },
      { column: 'p.serial', order: 'desc' },
      { column: 'p.revision', order: 'desc' },
    ]);
  return rows.map((row) => toPackSummary(row, publicUrl));
}

export async function revokePack(
  db: Knex,
  organisationId: string,
  packNumber: string,
  reason: string,
  actor: Actor,
) {
  const pack = await findPack(db, packNumber);
  if (!pack || pack.organisation_id !== organisationId) throw new NotFoundError();
  if (pack.revoked_at) throw new ConflictError(`${packNumber} is revoked already.`);
  await db.transaction(async (trx) => {
    await trx('pack_revocations').insert({
      pack_id: pack.id,
      reason,
      revoked_by: actor.actorUserId,
    });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'handover.pack_revoked',
      entityType: 'site',
      entityId: pack.site_id,
      organisationId,
      summary: `Handover pack ${packNumber} revoked: ${reason}`,
    });
  });
  return (await findPack(db, packNumber))!;
}

export async function verification(db: Knex, packNumber: string): Promise<Verification> {
  const pack = await findPack(db, packNumber);
  if (!pack) throw new NotFoundError(`No handover pack has the number ${packNumber}.`);
  const [key, installer] = await Promise.all([
    db<SealKeyRow>('seal_keys').where({ id: pack.seal_key_id }).first(),
    db('organisations').where({ id: pack.organisation_id }).first('name'),
  ]);
  return {
    packNumber: pack.pack_number,
    revision: pack.revision,
    status: packStatus(pack),
    supersededBy: pack.superseded_by,
    revokedReason: pack.revoked_reason,
    issuedAt: pack.issued_at.toISOString(),
    issuedBy: pack.issued_by_name,
    installer: installer.name,
    site: { reference: pack.site_reference, town: pack.site_town },
    sha256: pack.sha256,
    sizeBytes: pack.size_bytes,
    seal: {
      algorithm: 'Ed25519',
      keyId: keyFingerprint(key!.public_key),
      publicKey: key!.public_key,
      signedText: pack.sealed_text,
      signature: pack.seal,
      // Checked afresh on every request: the text must still name this pack's hash.
      valid:
        pack.sealed_text ===
          sealText({
            packNumber: pack.pack_number,
            issuedAt: pack.issued_at,
            sha256: pack.sha256,
          }) && verifySealText(pack.sealed_text, pack.seal, key!.public_key),
    },
  };
}

export async function checkPdf(db: Knex, packNumber: string, bytes: Buffer): Promise<PdfCheck> {
  const pack = await findPack(db, packNumber);
  if (!pack) throw new NotFoundError(`No handover pack has the number ${packNumber}.`);
  const uploadedSha256 = sha256Hex(bytes);
  const matches = uploadedSha256 === pack.sha256 && bytes.length === pack.size_bytes;
  return {
    packNumber: pack.pack_number,
    matches,
    uploadedSha256,
    expectedSha256: pack.sha256,
    uploadedBytes: bytes.length,
    message: matches
      ? `This file matches the issued pack ${pack.pack_number} byte for byte.`
      : bytes.length === 0
        ? 'The upload was empty.'
        : `This file does not match the issued pack ${pack.pack_number}: it has been changed, cut short or is a different document.`,
  };
}

export { findPack };
