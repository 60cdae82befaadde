import type { Knex } from 'knex';
import type { SiteDetail, SiteListItem, UrnStatus } from './schema';

/** API field names to columns of `sites`; the same map serves inserts and partial updates. */
const COLUMNS = {
  name: 'name',
  premisesType: 'premises_type',
  addressLine1: 'address_line1',
  addressLine2: 'address_line2',
  town: 'town',
  postcode: 'postcode',
  accessNotes: 'access_notes',
  hazards: 'hazards',
  riskNotes: 'risk_notes',
  requiredGrade: 'required_grade',
  gradeRationale: 'grade_rationale',
  environmentalClass: 'environmental_class',
  policeUrn: 'police_urn',
  urnStatus: 'urn_status',
  monitoringCentreId: 'monitoring_centre_id',
  monitoringAccount: 'monitoring_account',
} as const;

export type SiteValues = { [K in keyof typeof COLUMNS]?: unknown };

export function toColumns(values: SiteValues): Record<string, unknown> {
  const row: Record<string, unknown> = {};
  for (const [field, column] of Object.entries(COLUMNS)) {
    const value = values[field as keyof SiteValues];
    if (value !== undefined) row[column] = value;
  }
  return row;
}

export interface SiteRow {
  id: string;
  installer_id: string;
  reference: string;
  name: string;
  premises_type: 'domestic' | 'commercial';
  address_line1: string;
  address_line2: string;
  town: string;
  postcode: string;
  access_notes: string;
  hazards: string;
  risk_notes: string;
  required_grade: number;
  grade_rationale: string;
  environmental_class: number;
  police_urn: string | null;
  urn_status: UrnStatus;
  monitoring_centre_id: string | null;
  monitoring_account: string | null;
  version: number;
  created_at: Date;
  updated_at: Date;
}

export function findSiteRow(db: Knex, siteId: string) {
  return db<SiteRow>('sites').where({ id: siteId }).first();
}

/**
 * Site references are numbered per installer (S-0001, S-0002, …). The installer's row is locked
 * for the moment of numbering so two people creating sites at once get different numbers.
 */
export async function insertSite(trx: Knex.Transaction, installerId: string, values: SiteValues) {
  await trx('organisations').where({ id: installerId }).forUpdate().first('id');
  const { next } = (await trx('sites')
    .where({ installer_id: installerId })
    .first(
      trx.raw(`coalesce(max(substring(reference from '^S-(\\d+)$')::int), 0) + 1 as next`),
    )) as {
    next: number;
  };
  const [row] = await trx('sites')
    .insert({
      ...toColumns(values),
      installer_id: installerId,
      reference: `S-${String(next).padStart(4, '0')}`,
    })
    .returning('*');
  return row as SiteRow;
}

export interface SiteScope {
  installerIds: string[];
  monitoringCentreIds: string[];
}

export interface SiteListFilters {
  page: number;
  pageSize: number;
  sort: 'reference' | 'name' | 'town' | 'postcode' | 'requiredGrade' | 'updatedAt';
  order: 'asc' | 'desc';
  q?: string;
  grade?: number;
  urnStatus?: UrnStatus;
  monitored?: 'yes' | 'no';
  engineerId?: string;
}

const SORT_COLUMNS: Record<SiteListFilters['sort'], string> = {
  reference: 's.reference',
  name: 's.name',
  town: 's.town',
  postcode: 's.postcode',
  requiredGrade: 's.required_grade',
  updatedAt: 's.updated_at',
};

/** Escapes LIKE wildcards so a search for "50%" finds "50%", not everything. */
const likePattern = (text: string) => `%${text.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

interface SiteListRow {
  id: string;
  reference: string;
  name: string;
  town: string;
  postcode: string;
  premises_type: 'domestic' | 'commercial';
  required_grade: number;
  urn_status: UrnStatus;
  updated_at: Date;
  monitoring_centre_id: string | null;
  monitoring_centre_name: string | null;
  zone_count: number;
  engineers: { id: string; displayName: string }[];
}

function filteredSites(db: Knex, scope: SiteScope, filters: SiteListFilters) {
  return db('sites as s')
    .where((q) => {
      // Only the non-empty side of the scope, so a single installer's list can walk its index.
      if (scope.installerIds.length) q.orWhereIn('s.installer_id', scope.installerIds);
      if (scope.monitoringCentreIds.length)
        q.orWhereIn('s.monitoring_centre_id', scope.monitoringCentreIds);
      if (!scope.installerIds.length && !scope.monitoringCentreIds.length) q.whereRaw('false');
    })
    .modify((q) => {
      if (filters.q) q.where('s.search_text', 'like', likePattern(filters.q));
      if (filters.grade) q.where('s.required_grade', filters.grade);
      if (filters.urnStatus) q.where('s.urn_status', filters.urnStatus);
      if (filters.monitored === 'yes') q.whereNotNull('s.monitoring_centre_id');
      if (filters.monitored === 'no') q.whereNull('s.monitoring_centre_id');
      if (filters.engineerId) {
        q.whereExists(
          db('site_engineers as fe')
            .whereRaw('fe.site_id = s.id')
            .where('fe.user_id', filters.engineerId),
        );
      }
    });
}

/**
 * A page of sites in two queries, whatever the page size: the page itself (sorted and limited
 * on bare site rows, then given zone counts and engineers for those rows only) and the total.
 */
export async function listSites(db: Knex, scope: SiteScope, filters: SiteListFilters) {
  const page = filteredSites(db, scope, filters)
    .orderBy(SORT_COLUMNS[filters.sort], filters.order)
    .orderBy('s.id', 'asc')
    .limit(filters.pageSize)
    .offset((filters.page - 1) * filters.pageSize)
    .select('s.*');

  const [rows, counted] = await Promise.all([
    db
      .with('page', page)
      .from('page as s')
      .leftJoin('organisations as mc', 'mc.id', 's.monitoring_centre_id')
      .orderBy(SORT_COLUMNS[filters.sort], filters.order)
      .orderBy('s.id', 'asc')
      .select(
        's.id',
        's.reference',
        's.name',
        's.town',
        's.postcode',
        's.premises_type',
        's.required_grade',
        's.urn_status',
        's.updated_at',
        'mc.id as monitoring_centre_id',
        'mc.name as monitoring_centre_name',
        db.raw(
          `(select count(*)::int from zones z join systems sy on sy.id = z.system_id where sy.site_id = s.id) as zone_count`,
        ),
        db.raw(
          `coalesce((select json_agg(json_build_object('id', u.id, 'displayName', u.display_name) order by u.display_name)
             from site_engineers se join users u on u.id = se.user_id where se.site_id = s.id), '[]'::json) as engineers`,
        ),
      ) as Promise<SiteListRow[]>,
    filteredSites(db, scope, filters).count<{ count: number }[]>('* as count'),
  ]);

  const items: SiteListItem[] = rows.map((row) => ({
    id: row.id,
    reference: row.reference,
    name: row.name,
    town: row.town,
    postcode: row.postcode,
    premisesType: row.premises_type,
    requiredGrade: row.required_grade,
    urnStatus: row.urn_status,
    monitoringCentre: row.monitoring_centre_id
      ? { id: row.monitoring_centre_id, name: row.monitoring_centre_name ?? '' }
      : null,
    zoneCount: row.zone_count,
    engineers: row.engineers,
    updatedAt: row.updated_at.toISOString(),
  }));
  return { items, total: Number(counted[0]?.count ?? 0) };
}

/** Everything the workspace header and overview need, in one query. */
export async function getSiteDetail(db: Knex, siteId: string): Promise<SiteDetail | undefined> {
  const row = await db('sites as s')
    .join('organisations as i', 'i.id', 's.installer_id')
    .leftJoin('organisations as mc', 'mc.id', 's.monitoring_centre_id')
    .where('s.id', siteId)
    .first(
      's.*',
      'i.name as installer_name',
      'mc.name as monitoring_centre_name',
      db.raw(
        `coalesce((select json_agg(json_build_object('id', u.id, 'displayName', u.display_name) order by u.display_name)
           from site_engineers se join users u on u.id = se.user_id where se.site_id = s.id), '[]'::json) as engineers`,
      ),
      db.raw(
        `coalesce((select json_agg(json_build_object('id', u.id, 'displayName', u.display_name, 'email', u.email) order by u.display_name)
           from site_homeowners sh join users u on u.id = sh.user_id where sh.site_id = s.id), '[]'::json) as homeowners`,
      ),
      db.raw(
        `(select count(*)::int from zones z join systems sy on sy.id = z.system_id where sy.site_id = s.id) as zone_count`,
      ),
      db.raw(
        `(select count(*)::int from devices d join systems sy on sy.id = d.system_id where sy.site_id = s.id) as device_count`,
      ),
      db.raw(`(select count(*)::int from keyholders k where k.site_id = s.id) as keyholder_count`),
      db.raw(`(select count(*)::int from user_code_slots c where c.site_id = s.id) as slot_count`),
      db.raw(`(select count(*)::int from site_files f where f.site_id = s.id) as file_count`),
    );
  if (!row) return undefined;
  return {
    id: row.id,
    reference: row.reference,
    name: row.name,
    premisesType: row.premises_type,
    addressLine1: row.address_line1,
    addressLine2: row.address_line2,
    town: row.town,
    postcode: row.postcode,
    accessNotes: row.access_notes,
    hazards: row.hazards,
    riskNotes: row.risk_notes,
    requiredGrade: row.required_grade,
    gradeRationale: row.grade_rationale,
    environmentalClass: row.environmental_class,
    policeUrn: row.police_urn,
    urnStatus: row.urn_status,
    monitoringCentre: row.monitoring_centre_id
      ? { id: row.monitoring_centre_id, name: row.monitoring_centre_name }
      : null,
    monitoringAccount: row.monitoring_account,
    installer: { id: row.installer_id, name: row.installer_name },
    engineers: row.engineers,
    homeowners: row.homeowners,
    counts: {
      zones: row.zone_count,
      devices: row.device_count,
      keyholders: row.keyholder_count,
      userSlots: row.slot_count,
      files: row.file_count,
    },
    version: row.version,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
}

export async function replaceEngineers(trx: Knex.Transaction, siteId: string, userIds: string[]) {
  await trx('site_engineers').where({ site_id: siteId }).whereNotIn('user_id', userIds).delete();
  if (userIds.length) {
    await trx('site_engineers')
      .insert(userIds.map((userId) => ({ site_id: siteId, user_id: userId })))
      .onConflict(['site_id', 'user_id'])
      .ignore();
  }
}
