import type { Knex } from 'knex';
import type { ServiceVisit, VisitKind, VisitStatus } from './schema';

/** Calendar dates are the UK's: a visit done at 00:30 on a summer morning is that day's. */
export const SERVICE_TIME_ZONE = 'Europe/London';

/** Everything the plan of one site is worked out from, in one row. */
export interface PlanFactsRow {
  site_id: string;
  reference: string;
  name: string;
  town: string;
  centre_linked: boolean;
  paths_to_centre: number;
  paths_elsewhere: number;
  handed_over_on: string | null;
  plan_at_handover: number | null;
  commissioned_on: string | null;
  last_visit_on: string | null;
  last_visit_plan: number | null;
  booked_id: string | null;
  booked_due_date: string | null;
  booked_scheduled_for: Date | null;
  booked_engineer_name: string | null;
}

/**
 * One query for any number of sites: the overdue list reads a whole company's sites at once.
 * Handover is the first pack issued (a revision does not restart the plan). Commissioning, the
 * day of the latest recorded test, stands in for it only where no pack was issued and no
 * preventive visit done; it is the costly part (every zone's walk tests), so it is skipped
 * whenever the answer cannot need it.
 */
export function planFacts(db: Knex, sites: { siteId: string } | { installerIds: string[] }) {
  const zone = SERVICE_TIME_ZONE;
  return db
    .from('sites as s')
    .modify((query) => {
      if ('siteId' in sites) query.where('s.id', sites.siteId);
      else query.whereIn('s.installer_id', sites.installerIds);
    })
    .joinRaw(
      `left join lateral (
         select count(*) filter (where p.to_monitoring_centre) as paths_to_centre,
                count(*) filter (where not p.to_monitoring_centre) as paths_elsewhere
           from systems y join signalling_paths p on p.system_id = y.id
          where y.site_id = s.id
       ) paths on true`,
    )
    .joinRaw(
      `left join lateral (
         select (hp.issued_at at time zone ?)::date as handed_over_on,
                (hp.snapshot #>> '{servicePlan,visitsPerYear}')::int as plan_at_handover
           from handover_packs hp
          where hp.site_id = s.id
          order by hp.issued_at
          limit 1
       ) handover on true`,
      [zone],
    )
    .joinRaw(
      `left join lateral (
         select (v.completed_at at time zone ?)::date as last_visit_on,
                v.plan_visits_per_year as last_visit_plan
           from service_visits v
          where v.site_id = s.id and v.kind = 'preventive' and v.status = 'done'
          order by v.completed_at desc
          limit 1
       ) last_visit on true`,
      [zone],
    )
    .joinRaw(
      // CASE, not WHERE: PostgreSQL evaluates the sub-selects only on the rows that need them.
      `left join lateral (
         select case when handover.handed_over_on is null and last_visit.last_visit_on is null
                then (greatest(
                  (select max(st.tested_at) from systems y join system_tests st on st.system_id = y.id
                    where y.site_id = s.id),
                  (select max(wt.tested_at) from systems y join zones z on z.system_id = y.id
                     join walk_tests wt on wt.zone_id = z.id where y.site_id = s.id)
                ) at time zone ?)::date end as commissioned_on
       ) commissioning on true`,
      [zone],
    )
    .joinRaw(
      `left join lateral (
         select v.id as booked_id, v.due_date as booked_due_date,
                v.scheduled_for as booked_scheduled_for, u.display_name as booked_engineer_name
           from service_visits v left join users u on u.id = v.engineer_id
          where v.site_id = s.id and v.kind = 'preventive' and v.status = 'scheduled'
          limit 1
       ) booked on true`,
    )
    .select<PlanFactsRow[]>(
      's.id as site_id',
      's.reference',
      's.name',
      's.town',
      db.raw('s.monitoring_centre_id is not null as centre_linked'),
      db.raw('coalesce(paths.paths_to_centre, 0) as paths_to_centre'),
      db.raw('coalesce(paths.paths_elsewhere, 0) as paths_elsewhere'),
      'handover.handed_over_on',
      'handover.plan_at_handover',
      'commissioning.commissioned_on',
      'last_visit.last_visit_on',
      'last_visit.last_visit_plan',
      'booked.booked_id',
      'booked.booked_due_date',
      'booked.booked_scheduled_for',
      'booked.booked_engineer_name',
    )
    .orderBy('s.reference');
}

export interface VisitRow {
  id: string;
  site_id: string;
  kind: VisitKind;
  status: VisitStatus;
  due_date: string;
  scheduled_for: Date | null;
  engineer_id: string | null;
  plan_visits_per_year: number | null;
  reported_fault: string | null;
  completed_at: Date | null;
  client_key: string | null;
  completion_key: string | null;
  checklist: Record<string, unknown>;
  customer_name: string | null;
  prime_cause: string | null;
  action_taken: string | null;
  parts_replaced: { part: string; quantity: number }[];
  false_alarm: boolean | null;
  false_alarm_cause: string | null;
  version: number;
}

/** A visit with the site and engineer names the schedule shows. */
export interface VisitListRow extends VisitRow {
  installer_id: string;
  site_reference: string;
  site_name: string;
  site_town: string;
  engineer_name: string | null;
}

export const toServiceVisit = (row: VisitListRow): ServiceVisit => ({
  id: row.id,
  siteId: row.site_id,
  siteReference: row.site_reference,
  siteName: row.site_name,
  siteTown: row.site_town,
  kind: row.kind,
  status: row.status,
  dueDate: row.due_date,
  scheduledFor: row.scheduled_for?.toISOString() ?? null,
  engineer:
    row.engineer_id && row.engineer_name ? { id: row.engineer_id, name: row.engineer_name } : null,
  planVisitsPerYear: row.plan_visits_per_year,
  reportedFault: row.reported_fault,
  completedAt: row.completed_at?.toISOString() ?? null,
  version: row.version,
});

/** Every column of a visit but the customer's drawn signature, which lists never need. */
const VISIT_COLUMNS = [
  'id',
  'site_id',
  'kind',
  'status',
  'due_date',
  'scheduled_for',
  'engineer_id',
  'plan_visits_per_year',
  'reported_fault',
  'completed_at',
  'client_key',
  'completion_key',
  'checklist',
  'customer_name',
  'prime_cause',
  'action_taken',
  'parts_replaced',
  'false_alarm',
  'false_alarm_cause',
  'version',
].map((column) => `v.${column}`);

function visitsWithNames(db: Knex) {
  return db('service_visits as v')
    .join('sites as s', 's.id', 'v.site_id')
    .leftJoin('users as u', 'u.id', 'v.engineer_id')
    .select<VisitListRow[]>(
      ...VISIT_COLUMNS,
      's.installer_id',
      's.reference as site_reference',
      's.name as site_name',
      's.town as site_town',
      'u.display_name as engineer_name',
    );
}

export async function findVisit(db: Knex, visitId: string): Promise<VisitListRow | undefined> {
  const [row] = await visitsWithNames(db).where('v.id', visitId);
  return row;
}

export async function findVisitByClientKey(
  db: Knex,
  siteId: string,
  clientKey: string,
): Promise<VisitListRow | undefined> {
  const [row] = await visitsWithNames(db).where({ 'v.site_id': siteId, 'v.client_key': clientKey });
  return row;
}

/**
 * The installers' visits whose day falls in [from, to]: the booked day where there is one
 * (in UK time), else the due date, so unbooked visits still show on the day they fall due.
 */
export async function listVisits(
  db: Knex,
  filter: { installerIds: string[]; from: string; to: string; engineerId?: string },
): Promise<VisitListRow[]> {
  const day = db.raw('coalesce((v.scheduled_for at time zone ?)::date, v.due_date)', [
    SERVICE_TIME_ZONE,
  ]);
  return visitsWithNames(db)
    .whereIn('s.installer_id', filter.installerIds)
    .whereRaw('? between ? and ?', [day, filter.from, filter.to])
    .modify((query) => {
      if (filter.engineerId) query.where('v.engineer_id', filter.engineerId);
    })
    .orderByRaw('? , v.scheduled_for nulls last, s.reference', [day]);
}

/** Whether the person is an engineer of the installer (anyone else cannot be sent). */
export async function isEngineerOf(db: Knex, userId: string, installerId: string) {
  const row = await db('memberships')
    .where({ user_id: userId, organisation_id: installerId, role: 'engineer' })
    .first('user_id');
  return Boolean(row);
}
