import type { Knex } from 'knex';
import type { SiteFile } from './schema';

export interface SiteFileRow {
  id: string;
  site_id: string;
  storage_key: string;
  file_name: string;
  content_type: SiteFile['contentType'];
  size_bytes: number;
  sha256: string;
  description: string;
  uploaded_by: string | null;
  uploaded_at: Date;
}

export const toSiteFile = (row: SiteFileRow & { uploaded_by_name?: string | null }): SiteFile => ({
  id: row.id,
  fileName: row.file_name,
  contentType: row.content_type,
  sizeBytes: Number(row.size_bytes),
  sha256: row.sha256,
  description: row.description,
  uploadedBy: row.uploaded_by_name ?? null,
  uploadedAt: row.uploaded_at.toISOString(),
});

export async function listSiteFiles(db: Knex, siteId: string) {
  const rows = await db('site_files as f')
    .leftJoin('users as u', 'u.id', 'f.uploaded_by')
    .where('f.site_id', siteId)
    .orderBy('f.uploaded_at', 'desc')
    .select('f.*', 'u.display_name as uploaded_by_name');
  return rows.map(toSiteFile);
}

export function findSiteFile(db: Knex, siteId: string, fileId: string) {
  return db<SiteFileRow>('site_files').where({ site_id: siteId, id: fileId }).first();
}
