import type { PackSummary } from '@server/handover/schema';
import { PACK_STATUS_LOOKS } from '@/features/handover/components/pack-status-looks';
import { packStatusWords } from '@/features/handover/utils/pack-status';
import { cn } from '@/utils/cn';

type PackStatus = PackSummary['status'];

type PackStatusLabelProps = {
  status: PackStatus;
  supersededBy: string | null;
  revokedReason?: string | null;
  className?: string;
};

/** "Valid", "Superseded by HW-000042-R2" or "Revoked: reason", with an icon. */
export function PackStatusLabel({
  status,
  supersededBy,
  revokedReason = null,
  className,
}: PackStatusLabelProps) {
  const look = PACK_STATUS_LOOKS[status];
  return (
    <span className={cn('inline-flex items-start gap-1.5 font-semibold', className)}>
      <look.icon aria-hidden="true" className={cn('mt-0.5 size-4 shrink-0', look.colour)} />
      <span className="break-words">{packStatusWords(status, supersededBy, revokedReason)}</span>
    </span>
  );
}
