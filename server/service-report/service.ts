import { randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { FileStorage } from '../files/storage';
import type { PackBuildQueue } from '../handover/build-queue';
import { renderServiceReportPdfOffThread } from '../handover/pdf/render-off-thread';
import { ConflictError, ForbiddenError, NotFoundError } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { completedVisitOf } from '../service/completion';
import { findVisit } from '../service/repository';
import { ukDateOf } from '../service/service';
import { relationsToSite } from '../sites/access';
import type { UserWithMemberships } from '../users/repository';
import {
  findReportOfVisit,
  homeownersOfSite,
  queuedReportIds,
  type ServiceReportRow,
} from './repository';
import type { ServiceReportSnapshot } from './schema';

export interface ServiceReportDeps {
  db: Knex;
  storage: FileStorage;
  mailer: Mailer;
  logger: Logger;
  /** Draws reports off the request path; without it a report is drawn within the request. */
  reportQueue?: PackBuildQueue;
}

/** Starts the job for a visit's queued report (a resend of the form finds it already done). */
export async function requestServiceReport(deps: ServiceReportDeps, visitId: string) {
  const report = await findReportOfVisit(deps.db, visitId);
  if (!report || report.status !== 'queued') return;
  if (deps.reportQueue) await deps.reportQueue.enqueue(report.id);
  else await runServiceReport(deps, report.id);
}

/**
 * After a restart: reports queued when the process stopped (their job lost or never sent)
 * are sent to the queue again. A report already drawn by another process is skipped by the job.
 */
export async function resumeQueuedServiceReports(db: Knex, queue: PackBuildQueue) {
  for (const reportId of await queuedReportIds(db)) await queue.enqueue(reportId);
}

async function collectSnapshot(
  db: Knex,
  report: ServiceReportRow,
  now: Date,
): Promise<ServiceReportSnapshot> {
  const visit = await findVisit(db, report.visit_id);
  if (!visit || visit.status !== 'done') throw new ConflictError('The visit is not completed.');
  const [completed, site, installer, signature] = await Promise.all([
    completedVisitOf(db, visit, ukDateOf(now)),
    db('sites')
      .where({ id: visit.site_id })
      .first('name', 'reference', 'address_line1', 'address_line2', 'town', 'postcode', 'hazards'),
    db('organisations').where({ id: visit.installer_id }).first('name'),
    db('service_visits').where({ id: visit.id }).first('customer_signature'),
  ]);
  return {
    reportId: report.id,
    visit: completed,
    installer: { name: installer.name },
    site: {
      name: site.name,
      reference: site.reference,
      addressLines: [site.address_line1, site.address_line2, `${site.town} ${site.postcode}`]
        .map((line: string) => line.trim())
        .filter(Boolean),
      hazards: site.hazards ?? '',
    },
    customerSignature: signature.customer_signature ?? null,
    preparedAt: now.toISOString(),
  };
}

/**
 * The job: draws, stores and e-mails one visit's report. The report row stays locked while it
 * is drawn, so a second job for the same report waits and then finds it done; the e-mail is
 * claimed (emailed_at) before it is sent, so it goes at most once.
 */
export async function runServiceReport(deps: ServiceReportDeps, reportId: string): Promise<void> {
  const { db } = deps;
  let storedKey: string | null = null;
  try {
    const drawn = await db.transaction(async (trx) => {
      const report: ServiceReportRow | undefined = await trx('service_reports')
        .where({ id: reportId })
        .forUpdate()
        .first();
      if (!report || report.status !== 'queued') return null;
      const snapshot = await collectSnapshot(trx, report, new Date());
      const pdf = await renderServiceReportPdfOffThread(snapshot);
      storedKey = `service-reports/${report.site_id}/${randomUUID()}`;
      await deps.storage.put(storedKey, pdf);
      await trx('service_reports').where({ id: reportId }).update({
        status: 'done',
        pdf_key: storedKey,
        size_bytes: pdf.length,
        error: null,
        updated_at: trx.fn.now(),
      });
      return { snapshot, pdf };
    });
    storedKey = null;
    if (drawn)
      await emailServiceReport(deps, reportId, drawn.snapshot, drawn.pdf).catch((error: unknown) =>
        deps.logger.error({ err: error, reportId }, 'service report e-mail failed'),
      );
  } catch (error) {
    // A PDF stored for a report that was then not recorded is not kept.
    if (storedKey) await deps.storage.remove(storedKey).catch(() => undefined);
    deps.logger.error({ err: error, reportId }, 'service report failed');
    await db('service_reports')
      .where({ id: reportId, status: 'queued' })
      .update({
        status: 'failed',
        error: error instanceof Error ? error.message : String(error),
        updated_at: db.fn.now(),
      });
  }
}

async function emailServiceReport(
  deps: ServiceReportDeps,
  reportId: string,
  snapshot: ServiceReportSnapshot,
  pdf: Buffer,
) {
  const claimed = await deps
    .db('service_reports')
    .where({ id: reportId })
    .whereNull('emailed_at')
    .update({ emailed_at: deps.db.fn.now() }, ['id']);
  if (claimed.length === 0) return;
  const { visit, site, installer } = snapshot;
  const day = ukDateOf(new Date(visit.completedAt!));
  const homeowners = await homeownersOfSite(deps.db, visit.siteId);
  for (const homeowner of homeowners) {
    await deps.mailer.send({
      to: homeowner.email,
      subject: `Service report for ${site.name}, visit of ${day}`,
      text: [
        `Hello ${homeowner.name},`,
        '',
        `${installer.name} visited your alarm system at ${site.name} (${site.reference}) on ${day}. The report of the visit is attached.`,
        `Outcome: ${visit.outcome.words}`,
        visit.nextDueOn ? `The next preventive visit is due by ${visit.nextDueOn}.` : '',
        '',
        'Keep it with your home’s papers: your insurer may ask for proof of maintenance.',
        'You can also download it again from your service history when you sign in to Wardbook.',
      ].join('\n'),
      attachments: [
        {
          filename: `service-report-${site.reference}-${day}.pdf`,
          content: pdf,
          contentType: 'application/pdf',
        },
      ],
    });
  }
}

/**
 * The stored report of a visit, for the installer's engineers and office and the site's
 * homeowners. Anyone else is not told the visit exists.
 */
export async function openServiceReport(
  deps: Pick<ServiceReportDeps, 'db' | 'storage'>,
  user: UserWithMemberships,
  visitId: string,
): Promise<{ stream: Readable; sizeBytes: number; filename: string }> {
  const visit = await findVisit(deps.db, visitId);
  const access = visit ? await relationsToSite(deps.db, user, visit.site_id) : undefined;
  if (!visit || !access || access.relations.length === 0) throw new NotFoundError();
  if (!access.relations.some((relation) => ['engineer', 'office', 'homeowner'].includes(relation)))
    throw new ForbiddenError('The service report is for the installer and the homeowner.');
  if (visit.status !== 'done')
    throw new NotFoundError('This visit has no report: it is not completed yet.');
  const report = await findReportOfVisit(deps.db, visitId);
  if (!report) throw new NotFoundError('This visit has no report.');
  if (report.status === 'queued')
    throw new ConflictError('The service report is still being prepared: try again in a minute.');
  if (report.status === 'failed' || !report.pdf_key)
    throw new ConflictError('The service report could not be prepared; tell your installer.');
  const stream = await deps.storage.open(report.pdf_key);
  if (!stream) throw new NotFoundError('The report’s file is missing; tell your installer.');
  const day = ukDateOf(visit.completed_at!);
  return {
    stream,
    sizeBytes: report.size_bytes ?? 0,
    filename: `service-report-${visit.site_reference}-${day}.pdf`,
  };
}
