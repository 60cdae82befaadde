import { Link } from 'react-router-dom';

import { cn } from '@/utils/cn';

/** Wardbook's mark: a brass record book with a keyhole, its page edges showing. */
export function WardbookMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" aria-hidden="true" focusable="false" className={className}>
      <rect width="32" height="32" rx="7" fill="#14213D" />
      <rect x="8" y="5.5" width="16.5" height="18.5" rx="2" fill="#B7873A" />
      <rect x="8" y="5.5" width="3.5" height="18.5" rx="1.2" fill="#8A6326" />
      <path d="M9.5 24h15v2.6H11a1.5 1.5 0 0 1-1.5-1.5z" fill="#F8F6F1" />
      <circle cx="18" cy="12.6" r="2.4" fill="#14213D" />
      <path d="M16.8 14.2h2.4l.9 4.8h-4.2z" fill="#14213D" />
    </svg>
  );
}

type WordmarkLinkProps = { to: string; className?: string };

/** The mark and name, linking home. Its accessible name is simply "Wardbook". */
export function WordmarkLink({ to, className }: WordmarkLinkProps) {
  return (
    <Link
      to={to}
      className={cn(
        'inline-flex min-h-11 items-center gap-2 rounded-md pr-1 text-lg font-semibold tracking-tight text-paper no-underline',
        className,
      )}
    >
      <WardbookMark className="size-8 shrink-0" />
      <span>Wardbook</span>
    </Link>
  );
}
