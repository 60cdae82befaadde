import { Save } from 'lucide-react';

import { Button } from '@/components/ui/button';
import type { ButtonVariant } from '@/components/ui/button-styles';

type SubmitButtonProps = {
  label: string;
  isPending: boolean;
  /** What the button says while the save is on its way. */
  pendingLabel?: string;
  variant?: ButtonVariant;
};

/** A form's save button: disabled while the save is on its way, so it is not sent twice. */
export function SubmitButton({
  label,
  isPending,
  pendingLabel = 'Saving…',
  variant,
}: SubmitButtonProps) {
  return (
    <Button type="submit" variant={variant} disabled={isPending}>
      <Save aria-hidden="true" className="size-4" />
      {isPending ? pendingLabel : label}
    </Button>
  );
}
