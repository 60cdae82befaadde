import { useEffect, useId, useRef, useState, type ReactNode } from 'react';

import { Button } from '@/components/ui/button';
import type { ButtonSize, ButtonVariant } from '@/components/ui/button-styles';

type ConfirmButtonProps = {
  /** The visible words on the first button, e.g. "Remove". */
  children: ReactNode;
  /** Its full accessible name when the visible words need context, e.g. "Remove Sam Whitlock". */
  accessibleLabel?: string;
  question: string;
  confirmLabel: string;
  cancelLabel?: string;
  onConfirm: () => void;
  pending?: boolean;
  variant?: ButtonVariant;
  size?: ButtonSize;
};

/**
 * A button that asks before doing something that cannot be undone. The question opens in place
 * (no modal to trap focus), focus moves to the confirming button, and "cancel" hands focus back.
 */
export function ConfirmButton({
  children,
  accessibleLabel,
  question,
  confirmLabel,
  cancelLabel = 'Cancel',
  onConfirm,
  pending = false,
  variant = 'secondary',
  size = 'md',
}: ConfirmButtonProps) {
  const [isAsking, setIsAsking] = useState(false);
  const questionId = useId();
  const confirmRef = useRef<HTMLButtonElement>(null);
  const triggerRef = useRef<HTMLButtonElement>(null);
  const returnFocus = useRef(false);

  useEffect(() => {
    if (isAsking) confirmRef.current?.focus();
    else if (returnFocus.current) {
      returnFocus.current = false;
      triggerRef.current?.focus();
    }
  }, [isAsking]);

  if (!isAsking) {
    return (
      <Button
        ref={triggerRef}
        variant={variant}
        size={size}
        aria-label={accessibleLabel}
        onClick={() => setIsAsking(true)}
      >
        {children}
      </Button>
    );
  }

  return (
    <div
      role="group"
      aria-labelledby={questionId}
      className="flex basis-full flex-wrap items-center gap-2 rounded-md border border-ink bg-paper p-3"
    >
      <p id={questionId} className="basis-full font-semibold">
        {question}
      </p>
      <Button ref={confirmRef} size={size} disabled={pending} onClick={onConfirm}>
        {pending ? 'Working…' : confirmLabel}
      </Button>
      <Button
        variant="secondary"
        size={size}
        onClick={() => {
          returnFocus.current = true;
          setIsAsking(false);
        }}
      >
        {cancelLabel}
      </Button>
    </div>
  );
}
