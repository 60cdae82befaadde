import { priorityWeight, priorityWords } from '@/features/monitoring/utils/priority';
import { cn } from '@/utils/cn';

type PriorityMarkerProps = { priority: number; className?: string };

/**
 * Priority as a number, a word and five marks filled by weight, so it reads in words, by shape
 * and in greyscale alike.
 */
export function PriorityMarker({ priority, className }: PriorityMarkerProps) {
  const weight = priorityWeight(priority);
  return (
    <span className={cn('inline-flex items-center gap-2 whitespace-nowrap', className)}>
      <span aria-hidden="true" className="inline-flex items-end gap-0.5">
        {[1, 2, 3, 4, 5].map((mark) => (
          <span
            key={mark}
            className={cn(
              'w-1.5 rounded-sm border border-ink',
              mark <= weight ? 'bg-ink' : 'bg-white',
              ['h-1.5', 'h-2', 'h-2.5', 'h-3', 'h-3.5'][mark - 1],
            )}
          />
        ))}
      </span>
      <span className={cn(priority <= 2 ? 'font-bold' : priority === 3 ? 'font-semibold' : '')}>
        <span className="font-mono">{priority}</span> {priorityWords(priority)}
      </span>
    </span>
  );
}
