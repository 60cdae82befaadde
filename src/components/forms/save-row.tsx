import { CircleCheck } from 'lucide-react';

import { SubmitButton } from '@/components/forms/submit-button';
import type { ButtonSize, ButtonVariant } from '@/components/ui/button-styles';

type SaveRowProps = {
  saveLabel: string;
  isSaving: boolean;
  /** Said after a save went through; empty says nothing. */
  savedMessage: string;
  variant?: ButtonVariant;
  size?: ButtonSize;
};

/**
 * The save button at the foot of a form, and beside it word that the save went through. The
 * status region is always there, so screen readers notice when the words arrive.
 */
export function SaveRow({ saveLabel, isSaving, savedMessage, variant, size }: SaveRowProps) {
  return (
    <div className="flex flex-wrap items-center gap-4">
      <SubmitButton label={saveLabel} isPending={isSaving} variant={variant} size={size} />
      <p role="status" className="flex items-center gap-1.5 text-sm font-medium text-normal">
        {savedMessage ? (
          <>
            <CircleCheck aria-hidden="true" className="size-4 shrink-0" />
            {savedMessage}
          </>
        ) : null}
      </p>
    </div>
  );
}
