import {
  CircleCheck,
  CircleDashed,
  CircleX,
  Smartphone,
  TriangleAlert,
  type LucideIcon,
} from 'lucide-react';

import type { TestStatus } from '@/features/commissioning/utils/test-status';
import { cn } from '@/utils/cn';

// Each status is a word and an icon; the colour only repeats them.
const STATUSES: Record<TestStatus, { icon: LucideIcon; words: string; colour: string }> = {
  'not-tested': { icon: CircleDashed, words: 'Not tested', colour: 'text-ink-muted' },
  passed: { icon: CircleCheck, words: 'Passed', colour: 'text-normal' },
  failed: { icon: CircleX, words: 'Failed', colour: 'text-alarm' },
  'on-phone': { icon: Smartphone, words: 'Saved on this phone', colour: 'text-info' },
  refused: { icon: TriangleAlert, words: 'Not accepted', colour: 'text-alarm' },
};

export function TestStatusBadge({ status, className }: { status: TestStatus; className?: string }) {
  const { icon: Icon, words, colour } = STATUSES[status];
  return (
    <span
      className={cn('inline-flex items-center gap-1.5 text-sm font-semibold', colour, className)}
    >
      <Icon aria-hidden="true" className="size-4 shrink-0" />
      {words}
    </span>
  );
}
