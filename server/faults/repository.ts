import type { Knex } from 'knex';
import { FAULT_STATUS_WORDS, type FaultReport, type FaultStatus, type QueuedFault } from './schema';

interface FaultReportRow {
  id: string;
  site_id: string;
  site_reference: string;
  site_name: string;
  site_town: string;
  description: string;
  status: FaultStatus;
  closing_note: string;
  created_at: Date;
  reporter_name: string | null;
  reporter_email: string | null;
  visit_id: string | null;
  visit_due_date: string | null;
  visit_scheduled_for: Date | null;
  visit_engineer_name: string | null;
  photos: { id: string; fileName: string; contentType: string }[];
}

/** Fault reports with their site, reporter, booked visit and photos, in one query. */
export function faultReports(db: Knex) {
  return db('fault_reports as r')
    .join('sites as s', 's.id', 'r.site_id')
    .leftJoin('users as reporter', 'reporter.id', 'r.reported_by')
    .leftJoin('service_visits as v', 'v.id', 'r.visit_id')
    .leftJoin('users as engineer', 'engineer.id', 'v.engineer_id')
    .select<FaultReportRow[]>(
      'r.id',
      'r.site_id',
      's.reference as site_reference',
      's.name as site_name',
      's.town as site_town',
      'r.description',
      'r.status',
      'r.closing_note',
      'r.created_at',
      'reporter.display_name as reporter_name',
      'reporter.email as reporter_email',
      'r.visit_id',
      'v.due_date as visit_due_date',
      'v.scheduled_for as visit_scheduled_for',
      'engineer.display_name as visit_engineer_name',
      db.raw(
        `coalesce((select json_agg(json_build_object('id', f.id, 'fileName', f.file_name,
                     'contentType', f.content_type) order by f.uploaded_at, f.id)
                     from fault_report_photos p join site_files f on f.id = p.site_file_id
                    where p.fault_report_id = r.id), '[]'::json) as photos`,
      ),
    );
}

export function toFaultReport(row: FaultReportRow): FaultReport {
  return {
    id: row.id,
    siteId: row.site_id,
    description: row.description,
    status: row.status,
    statusWords: FAULT_STATUS_WORDS[row.status],
    photos: row.photos.map((photo) => ({
      ...photo,
      url: `/api/sites/${row.site_id}/files/${photo.id}/content`,
    })),
    reportedAt: row.created_at.toISOString(),
    visit:
      row.visit_id && row.visit_due_date
        ? {
            id: row.visit_id,
            dueDate: row.visit_due_date,
            scheduledFor: row.visit_scheduled_for?.toISOString() ?? null,
            engineerName: row.visit_engineer_name,
          }
        : null,
    closingNote: row.closing_note,
  };
}

export function toQueuedFault(row: FaultReportRow): QueuedFault {
  return {
    ...toFaultReport(row),
    siteReference: row.site_reference,
    siteName: row.site_name,
    siteTown: row.site_town,
    reportedBy:
      row.reporter_name && row.reporter_email
        ? { name: row.reporter_name, email: row.reporter_email }
        : null,
  };
}

export async function findFaultReport(db: Knex, where: Record<string, unknown>) {
  const [row] = await faultReports(db).where(where);
  return row;
}
