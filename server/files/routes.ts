import { createHash, randomUUID } from 'node:crypto';
import { Router, type RequestHandler } from 'express';
import { fileTypeFromBuffer } from 'file-type';
import type { Knex } from 'knex';
import multer from 'multer';
import { z } from 'zod';
import { actorOf } from '../audit/actor';
import { recordAuditEntry } from '../audit/repository';
import { AppError, ForbiddenError, NotFoundError, ValidationError } from '../http/errors';
import { parseRequest } from '../http/validate';
import {
  isInstallerStaff,
  RECORD_READERS,
  requireSiteRelation,
  siteAccessOf,
} from '../sites/access';
import { sanitiseFileName } from './file-names';
import { findSiteFile, listSiteFiles, toSiteFile, type SiteFileRow } from './repository';
import { ALLOWED_FILE_TYPES, MAX_FILE_BYTES, uploadFieldsSchema } from './schema';
import type { FileStorage } from './storage';

const fileParams = z.object({ fileId: z.uuid() });
const UPLOADERS = ['engineer', 'office', 'homeowner'] as const;
const allowed = new Set<string>(ALLOWED_FILE_TYPES);

/** One file per request, held in memory up to the limit so its type is read from its bytes. */
function receiveOneFile(): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_FILE_BYTES, files: 1, fields: 4, fieldSize: 4096, parts: 6 },
  }).single('file');
  return (req, res, next) =>
    upload(req, res, (error: unknown) => {
      if (!error) return next();
      const code = (error as { code?: string }).code;
      if (code === 'LIMIT_FILE_SIZE') {
        return next(
          new AppError(
            413,
            'too-large',
            'File too large',
            `Files can be at most ${MAX_FILE_BYTES / 1024 / 1024} MiB.`,
          ),
        );
      }
      if (code?.startsWith('LIMIT_') || code === 'MISSING_FIELD_NAME') {
        return next(
          new ValidationError([
            { path: 'body.file', message: 'Send one file in the field named "file".' },
          ]),
        );
      }
      next(error);
    });
}

export function createFilesRouter({ db, storage }: { db: Knex; storage: FileStorage }): Router {
  const router = Router();
  const fileId = (params: unknown) => parseRequest(fileParams, params, 'params').fileId;

  router.get(
    '/api/sites/:siteId/files',
    requireSiteRelation(db, ...RECORD_READERS),
    async function files(req, res) {
      res.json({ files: await listSiteFiles(db, siteAccessOf(req).id) });
    },
  );

  router.post(
    '/api/sites/:siteId/files',
    requireSiteRelation(db, ...UPLOADERS),
    receiveOneFile(),
    async function fileUpload(req, res) {
      const access = siteAccessOf(req);
      const { description } = parseRequest(uploadFieldsSchema, req.body ?? {}, 'body');
      if (!req.file) {
        throw new ValidationError([
          { path: 'body.file', message: 'Choose a photo or document to upload.' },
        ]);
      }
      // The browser's type and the name's extension are claims; the bytes decide.
      const detected = await fileTypeFromBuffer(req.file.buffer);
      if (!detected || !allowed.has(detected.mime)) {
        throw new AppError(
          415,
          'unsupported-type',
          'File type not accepted',
          'Upload a JPEG, PNG or WebP photo, or a PDF document.',
          [{ path: 'body.file', message: 'This file is not a JPEG, PNG, WebP or PDF.' }],
        );
      }
      const id = randomUUID();
      const storageKey = `sites/${access.id}/${id}`;
      const sha256 = createHash('sha256').update(req.file.buffer).digest('hex');
      const fileName = sanitiseFileName(req.file.originalname, detected.mime);
      await storage.put(storageKey, req.file.buffer);
      try {
        const row = await db.transaction(async (trx) => {
          const [inserted] = await trx('site_files')
            .insert({
              id,
              site_id: access.id,
              storage_key: storageKey,
              file_name: fileName,
              content_type: detected.mime,
              size_bytes: req.file!.size,
              sha256,
              description,
              uploaded_by: req.currentUser!.id,
            })
            .returning<SiteFileRow[]>('*');
          await recordAuditEntry(trx, {
            ...actorOf(req),
            action: 'file.uploaded',
            entityType: 'site_file',
            entityId: id,
            organisationId: access.installerId,
            summary: `Uploaded ${fileName} (${detected.mime}, ${req.file!.size} bytes)`,
            changes: { sha256: { to: sha256 } },
          });
          return inserted!;
        });
        res
          .status(201)
          .json(toSiteFile({ ...row, uploaded_by_name: req.currentUser!.displayName }));
      } catch (error) {
        // Nothing is half-saved: bytes without their record are removed again.
        await storage.remove(storageKey);
        throw error;
      }
    },
  );

  router.get(
    '/api/sites/:siteId/files/:fileId/content',
    requireSiteRelation(db, ...RECORD_READERS),
    async function fileDownload(req, res) {
      const file = await findSiteFile(db, siteAccessOf(req).id, fileId(req.params));
      if (!file) throw new NotFoundError();
      const stream = await storage.open(file.storage_key);
      if (!stream) throw new NotFoundError('The file’s contents are missing from storage.');
      const inline = req.query.inline === '1' && file.content_type.startsWith('image/');
      res.set({
        'Content-Type': file.content_type,
        'Content-Length': String(file.size_bytes),
        'Cache-Control': 'private, no-store',
        'Content-Security-Policy': "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'",
      });
      if (inline) res.set('Content-Disposition', 'inline');
      else res.attachment(file.file_name);
      stream.on('error', (error) => res.destroy(error));
      stream.pipe(res);
    },
  );

  router.delete(
    '/api/sites/:siteId/files/:fileId',
    requireSiteRelation(db, ...UPLOADERS),
    async function fileRemove(req, res) {
      const access = siteAccessOf(req);
      const file = await findSiteFile(db, access.id, fileId(req.params));
      if (!file) throw new NotFoundError();
      if (!isInstallerStaff(access) && file.uploaded_by !== req.currentUser!.id) {
        throw new ForbiddenError(
          'You can remove only files you uploaded; ask your installer about the others.',
        );
      }
      await db.transaction(async (trx) => {
        await trx('site_files').where({ id: file.id }).delete();
        await recordAuditEntry(trx, {
          ...actorOf(req),
          action: 'file.removed',
          entityType: 'site_file',
          entityId: file.id,
          organisationId: access.installerId,
          summary: `Removed ${file.file_name}`,
          changes: { sha256: { from: file.sha256, to: null } },
        });
      });
      await storage.remove(file.storage_key);
      res.status(204).end();
    },
  );

  return router;
}
