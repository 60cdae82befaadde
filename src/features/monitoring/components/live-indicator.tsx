import { LoaderCircle, Radio, RotateCw } from 'lucide-react';

import type { StreamState } from '@/features/monitoring/api/use-monitoring-stream';
import { cn } from '@/utils/cn';

const states: Record<StreamState, { label: string; detail: string; className: string }> = {
  live: {
    label: 'Live',
    detail: 'New signals appear here as they arrive.',
    className: 'border-normal text-normal',
  },
  connecting: {
    label: 'Connecting',
    detail: 'Opening the live feed.',
    className: 'border-info text-info',
  },
  reconnecting: {
    label: 'Reconnecting',
    detail: 'The live feed dropped; trying again. What is shown may be out of date.',
    className: 'border-fault text-fault-text',
  },
};

/** Whether the screen is receiving the centre's changes as they happen, in words and an icon. */
export function LiveIndicator({ state }: { state: StreamState }) {
  const { label, detail, className } = states[state];
  const Icon = state === 'live' ? Radio : state === 'connecting' ? LoaderCircle : RotateCw;
  return (
    <p
      role="status"
      title={detail}
      className={cn(
        'inline-flex min-h-8 items-center gap-1.5 rounded-full border-2 bg-white px-3 text-sm font-semibold',
        className,
      )}
    >
      <Icon
        aria-hidden="true"
        className={cn('size-4 shrink-0', state !== 'live' && 'motion-safe:animate-spin')}
      />
      <span>{label}</span>
      <span className="sr-only">: {detail}</span>
    </p>
  );
}
