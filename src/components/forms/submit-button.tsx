import { Save } from 'lucide-react';

import { Button } from '@/components/ui/button';
import type { ButtonSize, ButtonVariant } from '@/components/ui/button-styles';

type SubmitButtonProps = {
  label: string;
  isPending: boolean;
  /** What the button says while the save is on its way. */
  pendingLabel?: string;
  variant?: ButtonVariant;
  /** lg for forms used mostly on phones. */
  size?: ButtonSize;
};

/** A form's save button: disabled while the save is on its way, so it is not sent twice. */
export function SubmitButton({
  label,
  isPending,
  pendingLabel = 'Saving…',
  variant,
  size,
}: SubmitButtonProps) {
  return (
    <Button type="submit" variant={variant} size={size} disabled={isPending}>
      <Save aria-hidden="true" className={size === 'lg' ? 'size-5' : 'size-4'} />
      {isPending ? pendingLabel : label}
    </Button>
  );
}
