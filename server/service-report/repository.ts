import type { Knex } from 'knex';
import type { ServiceReportStatus } from './schema';

export interface ServiceReportRow {
  id: string;
  visit_id: string;
  site_id: string;
  status: ServiceReportStatus;
  pdf_key: string | null;
  size_bytes: number | null;
  error: string | null;
  emailed_at: Date | null;
}

/**
 * Queues the report of a visit being completed. Called inside the completion's transaction,
 * so a completed visit always has its report row, even if the process stops before the job is
 * sent; a second call for the same visit changes nothing.
 */
export async function queueServiceReport(
  trx: Knex | Knex.Transaction,
  visit: { visitId: string; siteId: string },
): Promise<void> {
  await trx('service_reports')
    .insert({ visit_id: visit.visitId, site_id: visit.siteId })
    .onConflict('visit_id')
    .ignore();
}

export async function findReportOfVisit(
  db: Knex,
  visitId: string,
): Promise<ServiceReportRow | undefined> {
  return db('service_reports').where({ visit_id: visitId }).first();
}

/** Reports still waiting for their PDF: a restarted API sends their jobs again. */
export async function queuedReportIds(db: Knex): Promise<string[]> {
  const rows: { id: string }[] = await db('service_reports')
    .where({ status: 'queued' })
    .orderBy('created_at')
    .select('id');
  return rows.map((row) => row.id);
}

/** The site's homeowners, who are sent the report. */
export async function homeownersOfSite(db: Knex, siteId: string) {
  return db('site_homeowners as h')
    .join('users as u', 'u.id', 'h.user_id')
    .where('h.site_id', siteId)
    .orderBy('u.display_name')
    .select<{ name: string; email: string }[]>('u.display_name as name', 'u.email');
}
