import { cn } from '@/utils/cn';

type ProgressBarProps = {
  label: string;
  /** 0 to 100. */
  percent: number;
  /** Words shown under the bar, e.g. "2.1 MB of 4.6 MB". */
  valueText: string;
  className?: string;
};

/** A determinate progress bar that says its value in words as well as by its length. */
export function ProgressBar({ label, percent, valueText, className }: ProgressBarProps) {
  const rounded = Math.round(Math.min(Math.max(percent, 0), 100));
  return (
    <div className={cn('grid gap-1.5', className)}>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={rounded}
        aria-valuetext={`${rounded}% (${valueText})`}
        className="h-3 overflow-hidden rounded-full border border-ink-muted bg-paper-deep"
      >
        <div className="h-full bg-ink transition-[width]" style={{ width: `${rounded}%` }} />
      </div>
      <p className="text-sm text-ink-muted">
        <span className="font-mono text-ink">{rounded}%</span> · {valueText}
      </p>
    </div>
  );
}
