import { useEffect, useId, useRef, useState, type FocusEvent } from 'react';
import { Check, ChevronDown } from 'lucide-react';
import { Link } from 'react-router-dom';

import type { ButtonSize } from '@/components/ui/button-styles';
import type { RoleEntry } from '@/features/auth/utils/role-grants';
import { roleHomeHref, roleLabels } from '@/lib/roles';
import type { Role } from '@/types/api';
import { cn } from '@/utils/cn';

// Homeowner and keyholder roles belong to the person, not to a company.
const personalRoleContext: Partial<Record<Role, string>> = {
  homeowner: 'Your own home',
  keyholder: 'Homes you hold keys for',
};

function describeContext(entry: RoleEntry): string | undefined {
  return entry.organisationNames.length > 0
    ? entry.organisationNames.join(', ')
    : personalRoleContext[entry.role];
}

type RoleSwitcherProps = {
  entries: readonly RoleEntry[];
  currentRole: Role | undefined;
  size?: ButtonSize;
};

/**
 * Lists the person's roles with their organisations. A plain disclosure of links, not an ARIA
 * menu: each role is a page, and links behave as people and screen readers expect.
 */
export function RoleSwitcher({ entries, currentRole, size = 'md' }: RoleSwitcherProps) {
  const [isOpen, setIsOpen] = useState(false);
  const containerRef = useRef<HTMLDivElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const listId = useId();

  useEffect(() => {
    if (!isOpen) return;
    const closeOnOutsidePointer = (event: PointerEvent) => {
      if (!containerRef.current?.contains(event.target as Node)) setIsOpen(false);
    };
    const closeOnEscape = (event: KeyboardEvent) => {
      if (event.key !== 'Escape') return;
      setIsOpen(false);
      buttonRef.current?.focus();
    };
    document.addEventListener('pointerdown', closeOnOutsidePointer);
    document.addEventListener('keydown', closeOnEscape);
    return () => {
      document.removeEventListener('pointerdown', closeOnOutsidePointer);
      document.removeEventListener('keydown', closeOnEscape);
    };
  }, [isOpen]);

  const current = entries.find((entry) => entry.role === currentRole) ?? entries[0];
  if (!current) return null;
  // Personal roles need no context on the button; the list explains them.
  const currentContext = current.organisationNames.join(', ');
  const currentLabel = (
    <>
      <span className="font-semibold">{roleLabels[current.role]}</span>
      {currentContext ? <span className="text-brass-light"> · {currentContext}</span> : null}
    </>
  );

  if (entries.length === 1) {
    return (
      <p className="text-sm">
        <span className="sr-only">Role: </span>
        {currentLabel}
      </p>
    );
  }

  const closeWhenFocusLeaves = (event: FocusEvent<HTMLDivElement>) => {
    if (!event.currentTarget.contains(event.relatedTarget)) setIsOpen(false);
  };

  return (
    <nav
      aria-label="Your roles"
      className="relative"
      ref={containerRef}
      onBlur={closeWhenFocusLeaves}
    >
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={isOpen}
        aria-controls={listId}
        onClick={() => setIsOpen((open) => !open)}
        className={cn(
          'inline-flex max-w-full items-center gap-2 rounded-md border border-paper/50 px-3 text-left text-sm text-paper hover:border-paper hover:bg-ink-soft',
          size === 'lg' ? 'min-h-12' : 'min-h-10',
        )}
      >
        <span className="min-w-0 truncate">
          <span className="sr-only">Switch role. Current role: </span>
          {currentLabel}
        </span>
        <ChevronDown
          aria-hidden="true"
          className={cn('size-4 shrink-0 transition-transform', isOpen && 'rotate-180')}
        />
      </button>
      <ul
        id={listId}
        hidden={!isOpen}
        className="absolute right-0 z-30 mt-2 w-[min(20rem,calc(100vw-2rem))] overflow-hidden rounded-lg border border-hairline bg-white py-1 text-ink shadow-lg"
      >
        {entries.map((entry) => {
          const isCurrent = entry.role === current.role;
          const context = describeContext(entry);
          return (
            <li key={entry.role}>
              <Link
                to={roleHomeHref(entry.role)}
                aria-current={isCurrent ? 'page' : undefined}
                onClick={() => setIsOpen(false)}
                className={cn(
                  'flex items-start gap-3 px-4 text-sm text-ink no-underline hover:bg-paper',
                  size === 'lg' ? 'min-h-12 py-3' : 'min-h-10 py-2',
                  isCurrent && 'bg-paper-deep',
                )}
              >
                <Check
                  aria-hidden="true"
                  className={cn('mt-0.5 size-4 shrink-0', isCurrent ? 'text-ink' : 'invisible')}
                />
                <span>
                  <span className="block font-semibold">{roleLabels[entry.role]}</span>
                  {context ? <span className="block text-ink-muted">{context}</span> : null}
                </span>
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
