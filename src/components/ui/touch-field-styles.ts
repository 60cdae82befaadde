import { cn } from '@/utils/cn';

// The border is ink-muted so the edge of a field keeps 3:1 against white and paper (WCAG 1.4.11).
const baseControl =
  'block w-full rounded-md border bg-white text-base text-ink placeholder:text-ink-muted disabled:bg-paper-deep';

/**
 * Class names for text inputs, selects and date fields on pages used mostly on phones: 48px tall,
 * with 16px text so phone browsers do not zoom in on focus.
 */
export function touchInputClassName({
  invalid = false,
  className,
}: { invalid?: boolean; className?: string } = {}): string {
  return cn(
    baseControl,
    'min-h-12 px-3 py-2',
    invalid ? 'border-2 border-alarm' : 'border-ink-muted',
    className,
  );
}

export function touchTextareaClassName({
  invalid = false,
  className,
}: { invalid?: boolean; className?: string } = {}): string {
  return cn(
    baseControl,
    'min-h-32 px-3 py-2',
    invalid ? 'border-2 border-alarm' : 'border-ink-muted',
    className,
  );
}
