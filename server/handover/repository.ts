import type { Knex } from 'knex';
import type { PackSummary } from './schema';

export interface DraftRow {
  id: string;
  site_id: string;
  variations: { text: string }[];
  engineer_signature: string | null;
  engineer_user_id: string | null;
  engineer_name: string | null;
  engineer_signed_at: Date | null;
  customer_signature: string | null;
  customer_name: string | null;
  customer_user_id: string | null;
  customer_signed_via: 'in_person' | 'request' | null;
  customer_signed_at: Date | null;
  version: number;
}

export interface PackRow {
  id: string;
  site_id: string;
  organisation_id: string;
  pack_number: string;
  serial: number;
  revision: number;
  supersedes_id: string | null;
  pdf_key: string;
  sha256: string;
  size_bytes: number;
  seal_key_id: string;
  sealed_text: string;
  seal: string;
  issued_at: Date;
  issued_by_name: string;
}

/** The draft for a site, made on first use; one per site. */
export async function ensureDraft(db: Knex, siteId: string): Promise<DraftRow> {
  await db('handover_drafts').insert({ site_id: siteId }).onConflict('site_id').ignore();
  return db('handover_drafts').where({ site_id: siteId }).first();
}

/** Packs with their standing: superseded when a later revision replaces them, or revoked. */
export function packsQuery(db: Knex) {
  return db('handover_packs as p')
    .join('sites as s', 's.id', 'p.site_id')
    .leftJoin('handover_packs as next', 'next.supersedes_id', 'p.id')
    .leftJoin('pack_revocations as r', 'r.pack_id', 'p.id')
    .select(
      'p.id',
      'p.site_id',
      'p.organisation_id',
      'p.pack_number',
      'p.serial',
      'p.revision',
      'p.supersedes_id',
      'p.pdf_key',
      'p.sha256',
      'p.size_bytes',
      'p.seal_key_id',
      'p.sealed_text',
      'p.seal',
      'p.issued_at',
      'p.issued_by_name',
      's.name as site_name',
      's.reference as site_reference',
      's.town as site_town',
      'next.pack_number as superseded_by',
      'r.reason as revoked_reason',
      'r.revoked_at',
    );
}

export type PackListRow = PackRow & {
  site_name: string;
  site_reference: string;
  site_town: string;
  superseded_by: string | null;
  revoked_reason: string | null;
  revoked_at: Date | null;
};

export function packStatus(row: Pick<PackListRow, 'superseded_by' | 'revoked_at'>) {
  return row.revoked_at ? 'revoked' : row.superseded_by ? 'superseded' : 'valid';
}

export function toPackSummary(row: PackListRow, publicUrl: string): PackSummary {
  return {
    packNumber: row.pack_number,
    revision: row.revision,
    siteId: row.site_id,
    siteName: row.site_name,
    status: packStatus(row),
    supersededBy: row.superseded_by,
    revokedReason: row.revoked_reason,
    issuedAt: row.issued_at.toISOString(),
    issuedBy: row.issued_by_name,
    sha256: row.sha256,
    sizeBytes: row.size_bytes,
    downloadUrl: `/api/packs/${row.pack_number}/pdf`,
    verifyUrl: `${publicUrl}/verify/${row.pack_number}`,
  };
}

export function findPack(db: Knex, packNumber: string): Promise<PackListRow | undefined> {
  return packsQuery(db).where('p.pack_number', packNumber).first();
}

export function listSitePacks(db: Knex, siteId: string): Promise<PackListRow[]> {
  return packsQuery(db)
    .where('p.site_id', siteId)
    .orderBy([
      { column: 'p.serial', order: 'desc' },
      { column: 'p.revision', order: 'desc' },
    ]);
}
