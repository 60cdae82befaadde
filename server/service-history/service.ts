import type { Knex } from 'knex';
import { faultReports, toFaultReport } from '../faults/repository';
import { packsQuery, packStatus, type PackListRow } from '../handover/repository';
import { VISIT_KIND_LABELS, type VisitKind, type VisitOutcome } from '../service/schema';
import type { ServiceHistory, ServiceHistoryEntry } from './schema';

/** How many of each kind the timeline carries: years of a home's history, not a log. */
const MOST_OF_EACH = 200;

/**
 * Everything that has happened to a home's system after it was installed, newest first: visits
 * done (with their outcome in words), faults the homeowner reported, and handover packs issued.
 */
export async function serviceHistory(db: Knex, siteId: string): Promise<ServiceHistory> {
  const [visits, faults, packs] = await Promise.all([
    db('service_visits as v')
      .leftJoin('users as u', 'u.id', 'v.engineer_id')
      .leftJoin('service_reports as sr', function reportOfVisit() {
        this.on('sr.visit_id', '=', 'v.id').andOnVal('sr.status', '=', 'done');
      })
      .where({ 'v.site_id': siteId, 'v.status': 'done' })
      .orderBy('v.completed_at', 'desc')
      .limit(MOST_OF_EACH)
      .select<
        {
          id: string;
          kind: VisitKind;
          completed_at: Date;
          outcome: VisitOutcome | null;
          engineer_name: string | null;
          report_id: string | null;
        }[]
      >(
        'v.id',
        'v.kind',
        'v.completed_at',
        db.raw(`v.checklist -> 'outcome' as outcome`),
        'u.display_name as engineer_name',
        'sr.id as report_id',
      ),
    faultReports(db).where('r.site_id', siteId).orderBy('r.created_at', 'desc').limit(MOST_OF_EACH),
    packsQuery(db)
      .where('p.site_id', siteId)
      .orderBy('p.issued_at', 'desc')
      .limit(MOST_OF_EACH) as Promise<PackListRow[]>,
  ]);

  const entries: ServiceHistoryEntry[] = [
    ...visits.map((visit): ServiceHistoryEntry => ({
      kind: 'visit',
      id: visit.id,
      at: visit.completed_at.toISOString(),
      visitKind: visit.kind,
      title: `${VISIT_KIND_LABELS[visit.kind]} done`,
      outcome: visit.outcome?.words ?? '',
      passed: visit.outcome?.passed ?? null,
      findings: visit.outcome?.findings ?? [],
      engineerName: visit.engineer_name,
      reportUrl: visit.report_id ? `/api/service/visits/${visit.id}/report.pdf` : null,
    })),
    ...faults.map((row): ServiceHistoryEntry => {
      const report = toFaultReport(row);
      return {
        kind: 'fault_report',
        id: report.id,
        at: report.reportedAt,
        title: 'Fault reported',
        description: report.description,
        status: report.status,
        statusWords: report.statusWords,
        photoCount: report.photos.length,
        visitId: report.visit?.id ?? null,
      };
    }),
    ...packs.map((pack): ServiceHistoryEntry => ({
      kind: 'handover_pack',
      id: pack.id,
      at: pack.issued_at.toISOString(),
      title:
        pack.revision > 1
          ? `Handover pack ${pack.pack_number} issued (revision ${pack.revision})`
          : `Handover pack ${pack.pack_number} issued`,
      packNumber: pack.pack_number,
      revision: pack.revision,
      status: packStatus(pack),
      downloadUrl: `/api/packs/${pack.pack_number}/pdf`,
    })),
  ];
  // ISO 8601 instants in UTC sort as text; ties keep a fixed order by id.
  entries.sort((a, b) => (a.at === b.at ? (a.id < b.id ? 1 : -1) : a.at < b.at ? 1 : -1));
  return { siteId, entries };
}
