import {
  PACK_NUMBER_PATTERN,
  PACK_PREFIX_PATTERN,
  type PackSummary,
} from '@server/handover/schema';

/**
 * Pack numbers read PREFIX-NNNNNN-Rn: the office's prefix, a gap-free number, and the revision.
 * A correction is a new revision of the same number, so "HW-000042" names the document and
 * "HW-000042-R2" one issue of it.
 */

/** "HW", 43, 1 → "HW-000043-R1". */
export function formatPackNumber(prefix: string, number: number, revision = 1): string {
  return `${prefix}-${String(number).padStart(6, '0')}-R${revision}`;
}

/** The number the next new pack will carry, or null while the prefix typed is not a valid one. */
export function nextPackNumberPreview(prefixTyped: string, nextNumber: number): string | null {
  const prefix = prefixTyped.trim().toUpperCase();
  return PACK_PREFIX_PATTERN.test(prefix) ? formatPackNumber(prefix, nextNumber) : null;
}

/** A pack number as people may type it (lower case, spaces) in its one true form, or null. */
export function normalisePackNumber(typed: string): string | null {
  const packNumber = typed.trim().toUpperCase();
  return PACK_NUMBER_PATTERN.test(packNumber) ? packNumber : null;
}

/** "HW-000042-R2" → "HW-000042": the document every revision belongs to. */
export function packDocumentNumber(packNumber: string): string {
  return packNumber.replace(/-R\d+$/, '');
}

/** Every issue of one document, newest revision first. */
export type PackDocument = { documentNumber: string; revisions: PackSummary[] };

/** One home's documents, the most recently issued first. */
export type HomeDocuments = { siteId: string; siteName: string; documents: PackDocument[] };

const newestIssue = (document: PackDocument) => document.revisions[0]?.issuedAt ?? '';

/**
 * Groups packs by home, then by document, so a homeowner sees each handover once with its
 * revisions beneath it rather than a flat list in which superseded issues look current.
 */
export function groupPacksByHome(packs: readonly PackSummary[]): HomeDocuments[] {
  const homes = new Map<string, { siteName: string; documents: Map<string, PackSummary[]> }>();
  for (const pack of packs) {
    const home = homes.get(pack.siteId) ?? { siteName: pack.siteName, documents: new Map() };
    homes.set(pack.siteId, home);
    const documentNumber = packDocumentNumber(pack.packNumber);
    home.documents.set(documentNumber, [...(home.documents.get(documentNumber) ?? []), pack]);
  }
  return [...homes.entries()]
    .map(([siteId, home]) => ({
      siteId,
      siteName: home.siteName,
      documents: [...home.documents.entries()]
        .map(([documentNumber, revisions]) => ({
          documentNumber,
          revisions: [...revisions].sort((a, b) => b.revision - a.revision),
        }))
        .sort((a, b) => newestIssue(b).localeCompare(newestIssue(a))),
    }))
    .sort((a, b) => a.siteName.localeCompare(b.siteName, 'en-GB'));
}
