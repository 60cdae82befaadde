import type { PackSummary } from '@server/handover/schema';

type PackStatus = PackSummary['status'];

/** A pack's status in words, complete enough to stand without its icon or colour. */
export function packStatusWords(
  status: PackStatus,
  supersededBy: string | null,
  revokedReason: string | null = null,
): string {
  switch (status) {
    case 'valid':
      return 'Valid';
    case 'superseded':
      return supersededBy ? `Superseded by ${supersededBy}` : 'Superseded';
    case 'revoked':
      return revokedReason ? `Revoked: ${revokedReason}` : 'Revoked';
  }
}
