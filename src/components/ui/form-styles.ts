import { cn } from '@/utils/cn';

// Dense controls stay above the 24 px minimum target (WCAG 2.2 2.5.8) while fitting table rows.
const controlBase =
  'block w-full rounded-md border border-ink/40 bg-white text-ink placeholder:text-ink-muted/80 ' +
  'disabled:cursor-not-allowed disabled:bg-paper-deep disabled:text-ink-muted ' +
  'aria-[invalid=true]:border-2 aria-[invalid=true]:border-alarm';

export type ControlSize = 'dense' | 'md';

const sizeClassNames: Record<ControlSize, string> = {
  dense: 'min-h-9 px-2 py-1 text-sm',
  md: 'min-h-10 px-3 py-2 text-sm',
};

/** Class names for text inputs and text areas. */
export function inputClassName({
  size = 'md',
  mono = false,
  className,
}: { size?: ControlSize; mono?: boolean; className?: string } = {}): string {
  return cn(controlBase, sizeClassNames[size], mono && 'font-mono', className);
}

/** Class names for native selects; the arrow is the browser's own, so it stays accessible. */
export function selectClassName({
  size = 'md',
  className,
}: { size?: ControlSize; className?: string } = {}): string {
  return cn(controlBase, sizeClassNames[size], 'pr-8', className);
}

export const checkboxClassName = 'size-4 shrink-0 accent-ink';
