import { cn } from '@/utils/cn';

export type ButtonVariant = 'primary' | 'secondary' | 'on-ink';
export type ButtonSize = 'md' | 'lg';

const variantClassNames: Record<ButtonVariant, string> = {
  // Brass carries ink text: white on brass would fall below AA contrast.
  primary: 'border border-brass-deep bg-brass text-ink hover:bg-brass-light',
  secondary: 'border border-ink/35 bg-white text-ink hover:bg-paper-deep',
  'on-ink': 'border border-paper/50 bg-transparent text-paper hover:border-paper hover:bg-ink-soft',
};

// md stays above the 24px minimum target; lg meets the 44px phone guidance.
const sizeClassNames: Record<ButtonSize, string> = {
  md: 'min-h-10 px-4 text-sm',
  lg: 'min-h-12 px-5 text-base',
};

/** Class names for anything that should look like a button, including plain sign-in links. */
export function buttonClassName({
  variant = 'primary',
  size = 'md',
  className,
}: { variant?: ButtonVariant; size?: ButtonSize; className?: string } = {}): string {
  return cn(
    'inline-flex items-center justify-center gap-2 rounded-md font-semibold no-underline transition-colors',
    'disabled:cursor-not-allowed disabled:opacity-70',
    variantClassNames[variant],
    sizeClassNames[size],
    className,
  );
}
