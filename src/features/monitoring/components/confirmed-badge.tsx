import { BadgeCheck } from 'lucide-react';

/** A second detector inside the site's window confirmed the intruder alarm (BS 8243). */
export function ConfirmedBadge() {
  return (
    <span className="inline-flex items-center gap-1 rounded-sm border border-alarm bg-white px-1.5 text-xs font-bold tracking-wide text-alarm uppercase">
      <BadgeCheck aria-hidden="true" className="size-3.5 shrink-0" />
      Confirmed
    </span>
  );
}
