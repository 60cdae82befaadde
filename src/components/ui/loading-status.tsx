import { LoaderCircle } from 'lucide-react';

import { cn } from '@/utils/cn';

type LoadingStatusProps = { label?: string; className?: string };

/** A spinner with words, announced politely by screen readers. */
export function LoadingStatus({ label = 'Loading', className }: LoadingStatusProps) {
  return (
    <div role="status" className={cn('flex items-center gap-3 text-ink-muted', className)}>
      <LoaderCircle aria-hidden="true" className="size-5 shrink-0 motion-safe:animate-spin" />
      <span>{label}…</span>
    </div>
  );
}

export function FullPageLoading({ label = 'Loading Wardbook' }: { label?: string }) {
  return (
    <div className="flex min-h-dvh items-center justify-center bg-paper p-6">
      <LoadingStatus label={label} />
    </div>
  );
}
