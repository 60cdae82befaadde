import {
  BadgeCheck,
  CircleDashed,
  Hourglass,
  ShieldOff,
  TriangleAlert,
  type LucideIcon,
} from 'lucide-react';

import type { UrnStatus } from '@server/sites/schema';
import { URN_STATUS_LABELS } from '@/features/sites/utils/labels';
import { cn } from '@/utils/cn';

// Colour only backs up the word and the icon; none of the states relies on it.
const urnStyles: Record<UrnStatus, { icon: LucideIcon; className: string }> = {
  none: { icon: CircleDashed, className: 'text-ink-muted' },
  applied: { icon: Hourglass, className: 'text-info' },
  active: { icon: BadgeCheck, className: 'text-normal' },
  warning: { icon: TriangleAlert, className: 'text-fault-text' },
  withdrawn: { icon: ShieldOff, className: 'text-alarm' },
};

export function UrnStatusBadge({ status }: { status: UrnStatus }) {
  const { icon: Icon, className } = urnStyles[status];
  return (
    <span
      className={cn('inline-flex items-center gap-1.5 font-medium whitespace-nowrap', className)}
    >
      <Icon aria-hidden="true" className="size-4 shrink-0" />
      {URN_STATUS_LABELS[status]}
    </span>
  );
}
