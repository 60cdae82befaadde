import { createHash, randomUUID } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { z } from 'zod';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { sanitiseFileName } from '../files/file-names';
import type { FileStorage } from '../files/storage';
import { AppError } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { faultReports, findFaultReport, toFaultReport, toQueuedFault } from './repository';
import {
  FAULT_PHOTO_TYPES,
  type faultQueueQuerySchema,
  type FaultReport,
  type faultReportInputSchema,
} from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;

export interface FaultDeps {
  db: Knex;
  storage: FileStorage;
  mailer: Mailer;
  logger: Logger;
  /** The app's public origin, for the link in the acknowledgement. */
  appUrl: string;
}

export interface UploadedPhoto {
  originalName: string;
  bytes: Buffer;
}

const photoTypes = new Set<string>(FAULT_PHOTO_TYPES);
const ONE_REPORT_PER_KEY = 'fault_reports_site_id_client_key_unique';

/** Each photo's type from its bytes (the name and the browser's type are only claims). */
async function checkedPhotos(photos: UploadedPhoto[]) {
  const checked = [];
  const refused: { path: string; message: string }[] = [];
  for (const [index, photo] of photos.entries()) {
    const detected = await fileTypeFromBuffer(photo.bytes);
    if (!detected || !photoTypes.has(detected.mime))
      refused.push({
        path: `body.photos.${index}`,
        message: `${sanitiseFileName(photo.originalName, '')} is not a JPEG, PNG or WebP photo.`,
      });
    else checked.push({ ...photo, contentType: detected.mime });
  }
  if (refused.length > 0)
    throw new AppError(
      415,
      'unsupported-type',
      'Photo type not accepted',
      'Attach photos as JPEG, PNG or WebP. Nothing was saved.',
      refused,
    );
  return checked;
}

/**
 * Records a homeowner's fault report with its photos (stored as ordinary site files), in one
 * transaction, then acknowledges it by e-mail. Sent twice with the same key, it is recorded
 * (and acknowledged) once.
 */
export async function reportFault(
  deps: FaultDeps,
  site: { id: string; installerId: string },
  reporter: { id: string; email: string; displayName: string },
  input: z.output<typeof faultReportInputSchema>,
  photos: UploadedPhoto[],
  actor: Actor,
): Promise<{ created: boolean; report: FaultReport & { acknowledgementSent: boolean } }> {
  const { db, storage } = deps;
  const previous = async () => {
    const row = input.clientKey
      ? await findFaultReport(db, { 'r.site_id': site.id, 'r.client_key': input.clientKey })
      : undefined;
    return row && { created: false, report: { ...toFaultReport(row), acknowledgementSent: true } };
  };
  const repeat = await previous();
  if (repeat) return repeat;

  const checked = await checkedPhotos(photos);
  const stored = checked.map((photo) => {
    const id = randomUUID();
    return { ...photo, id, storageKey: `sites/${site.id}/${id}` };
  });
  let reportId: string;
  try {
    for (const photo of stored) await storage.put(photo.storageKey, photo.bytes);
    reportId = await db.transaction(async (trx) => {
      const [report] = await trx('fault_reports')
        .insert({
          site_id: site.id,
          reported_by: reporter.id,
          description: input.description,
          client_key: input.clientKey ?? null,
        })
        .returning<{ id: string }[]>('id');
      for (const [index, photo] of stored.entries()) {
        await trx('site_files').insert({
          id: photo.id,
          site_id: site.id,
          storage_key: photo.storageKey,
          file_name: sanitiseFileName(photo.originalName, photo.contentType),
          content_type: photo.contentType,
          size_bytes: photo.bytes.length,
          sha256: createHash('sha256').update(photo.bytes).digest('hex'),
          description: 'Photo with a reported fault',
          uploaded_by: reporter.id,
          // now() is the transaction's start for every row: a microsecond apiece keeps the
          // photos in the order they were attached.
          uploaded_at: trx.raw("now() + ? * interval '1 microsecond'", [index]),
        });
        await trx('fault_report_photos').insert({
          fault_report_id: report!.id,
          site_file_id: photo.id,
        });
      }
      await recordAuditEntry(trx, {
        ...actor,
        action: 'fault_report.created',
        entityType: 'fault_report',
        entityId: report!.id,
        organisationId: site.installerId,
        summary: `Fault reported by ${reporter.displayName}${stored.length > 0 ? ` with ${stored.length} photo(s)` : ''}`,
      });
      return report!.id;
    });
  } catch (error) {
    // Nothing is half-saved: bytes without their records are removed again.
    await Promise.all(stored.map((photo) => storage.remove(photo.storageKey)));
    const { code, constraint } = error as { code?: string; constraint?: string };
    if (code === '23505' && constraint === ONE_REPORT_PER_KEY) {
      const raced = await previous();
      if (raced) return raced;
    }
    throw error;
  }

  const report = toFaultReport((await findFaultReport(db, { 'r.id': reportId }))!);
  const acknowledgementSent = await acknowledge(deps, site.id, reporter, report).then(
    () => true,
    (error: unknown) => {
      deps.logger.error({ err: error, faultReportId: reportId }, 'fault acknowledgement failed');
      return false;
    },
  );
  return { created: true, report: { ...report, acknowledgementSent } };
}

async function acknowledge(
  deps: FaultDeps,
  siteId: string,
  reporter: { email: string; displayName: string },
  report: FaultReport,
) {
  const site = await deps
    .db('sites as s')
    .join('organisations as i', 'i.id', 's.installer_id')
    .where('s.id', siteId)
    .first(
      's.name',
      's.reference',
      'i.name as installer_name',
      'i.phone as installer_phone',
      'i.out_of_hours_phone as installer_out_of_hours_phone',
    );
  const phones = [
    site.installer_phone && `on ${site.installer_phone}`,
    site.installer_out_of_hours_phone && `(out of hours ${site.installer_out_of_hours_phone})`,
  ]
    .filter(Boolean)
    .join(' ');
  await deps.mailer.send({
    to: reporter.email,
    subject: `We have your fault report for ${site.name}`,
    text: [
      `Hello ${reporter.displayName},`,
      '',
      `Thank you for telling us about a problem with the alarm at ${site.name} (${site.reference}). Your report has gone to ${site.installer_name}, who will be in touch to arrange a visit.`,
      '',
      'What you told us:',
      report.description,
      ...(report.photos.length > 0
        ? [`With ${report.photos.length === 1 ? 'one photo' : `${report.photos.length} photos`}.`]
        : []),
      '',
      `If it cannot wait, call ${site.installer_name}${phones ? ` ${phones}` : ''}.`,
      '',
      'Until then, please stay safe:',
      '- Do not open the control panel or a sounder: there is mains power inside, and the engineer will isolate it first.',
      '- Do not climb a ladder to reach a sounder or detector; leave work at height to your engineer.',
      '- If the alarm goes off and you see signs of a break-in, do not go in: call 999 from somewhere safe.',
      'Repairs are for a qualified alarm engineer working to local codes and regulations.',
      '',
      `You can follow your report under your home’s service history when you sign in at ${deps.appUrl}/`,
    ].join('\n'),
  });
}

/** The office's queue: reports on their companies' sites, open ones first, oldest first. */
export async function faultQueue(
  db: Knex,
  officeInstallerIds: string[],
  query: z.output<typeof faultQueueQuerySchema>,
) {
  if (officeInstallerIds.length === 0) return { faults: [] };
  const statuses =
    query.status === 'all'
      ? ['open', 'scheduled', 'closed']
      : query.status === 'active'
        ? ['open', 'scheduled']
        : [query.status];
  const rows = await faultReports(db)
    .whereIn('s.installer_id', officeInstallerIds)
    .whereIn('r.status', statuses)
    // Open and booked: the oldest waiting first. Closed: the most recent first.
    .orderByRaw(
      `case r.status when 'open' then 0 when 'scheduled' then 1 else 2 end,
       case when r.status = 'closed' then r.created_at end desc, r.created_at, r.id`,
    )
    // A queue longer than this is a backlog to work through, not a page to read.
    .limit(500);
  return { faults: rows.map(toQueuedFault) };
}
