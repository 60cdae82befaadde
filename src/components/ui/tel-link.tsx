import { Phone } from 'lucide-react';

import { formatPhoneForReading, phoneHref } from '@/lib/phone';
import { cn } from '@/utils/cn';

type TelLinkProps = {
  phone: string;
  /** Read before the number by screen readers, e.g. "Call Sam Whitlock on". */
  accessiblePrefix?: string;
  /** Large targets for phone-first pages. */
  large?: boolean;
  className?: string;
};

/** A phone number people can tap to ring, set in the monospace face like other numbers. */
export function TelLink({ phone, accessiblePrefix, large = false, className }: TelLinkProps) {
  return (
    <a
      href={phoneHref(phone)}
      className={cn(
        'inline-flex items-center gap-1.5 font-mono font-medium text-ink underline-offset-4',
        large ? 'min-h-11 text-lg' : 'min-h-6',
        className,
      )}
    >
      <Phone aria-hidden="true" className={cn('shrink-0', large ? 'size-5' : 'size-4')} />
      {accessiblePrefix ? <span className="sr-only">{accessiblePrefix} </span> : null}
      {formatPhoneForReading(phone)}
    </a>
  );
}
