import type { Knex } from 'knex';

export interface CredentialsRow {
  id: string;
  monitoring_centre_id: string;
  monitoring_account: string;
  dc09_key: string | null;
  intake_token_hash: string | null;
  intake_token_issued_at: Date | null;
}

const COLUMNS = [
  'id',
  'monitoring_centre_id',
  'monitoring_account',
  'dc09_key',
  'intake_token_hash',
  'intake_token_issued_at',
] as const;

/** A monitored site of one of these centres; undefined for any other site. */
export function findCentreSite(db: Knex, centreIds: string[], siteId: string) {
  return db<CredentialsRow>('sites')
    .where({ id: siteId })
    .whereIn('monitoring_centre_id', centreIds)
    .whereNotNull('monitoring_account')
    .first(...COLUMNS);
}

export async function updateDc09Key(trx: Knex, siteId: string, dc09Key: string | null) {
  const [row] = await trx<CredentialsRow>('sites')
    .where({ id: siteId })
    .update({ dc09_key: dc09Key })
    .returning([...COLUMNS]);
  return row!;
}

export async function storeIntakeTokenHash(trx: Knex, siteId: string, hash: string) {
  const [row] = await trx<CredentialsRow>('sites')
    .where({ id: siteId })
    .update({ intake_token_hash: hash, intake_token_issued_at: trx.fn.now() })
    .returning([...COLUMNS]);
  return row!;
}

/** Monitored sites holding this account: normally one (see recordSignal for two or more). */
export function monitoredSitesWithAccount(db: Knex, account: string) {
  return db<CredentialsRow>('sites')
    .whereNotNull('monitoring_centre_id')
    .where({ monitoring_account: account })
    .select(...COLUMNS);
}

/**
 * The DC-09 key for an account, placed as recordSignal places signals: only when exactly one
 * monitored site holds it. An account two centres share has no key the receiver can trust.
 */
export async function dc09KeyForAccount(db: Knex, account: string): Promise<string | null> {
  const sites = await monitoredSitesWithAccount(db, account);
  return sites.length === 1 ? sites[0]!.dc09_key : null;
}

export function siteWithIntakeTokenHash(db: Knex, hash: string) {
  return db<CredentialsRow>('sites')
    .where({ intake_token_hash: hash })
    .whereNotNull('monitoring_centre_id')
    .first(...COLUMNS);
}
