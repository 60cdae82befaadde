import { useRef, useState, type ChangeEvent, type ReactNode } from 'react';
import { Search, X } from 'lucide-react';
import { useNavigation } from 'react-router-dom';

import { GRADES } from '@server/schema/fields';
import { URN_STATUSES } from '@server/sites/schema';
import { Button } from '@/components/ui/button';
import { inputClassName, selectClassName } from '@/components/ui/form-styles';
import { URN_STATUS_LABELS } from '@/features/sites/utils/labels';
import type { SiteListFilters } from '@/features/sites/utils/list-filters';
import type { Person } from '@/types/api';

// Long enough that a word is typed before the list is asked for it, short enough to feel live.
const searchDelayMs = 300;

type FilterChange = Partial<
  Pick<SiteListFilters, 'q' | 'grade' | 'urnStatus' | 'monitored' | 'engineerId'>
>;

type SiteListFiltersProps = {
  filters: SiteListFilters;
  engineers: readonly Person[];
  /** The signed-in person, marked "(you)" in the engineer filter. */
  currentUserId: string | undefined;
  onChange: (change: FilterChange) => void;
};

/**
 * The search box keeps what is typed in its own state and tells the page after a pause; the page
 * keeps everything in the address bar, so reloading and the back button bring the same list.
 */
function SearchBox({ value, onSearch }: { value: string; onSearch: (q: string) => void }) {
  const navigation = useNavigation();
  const [text, setText] = useState(value);
  // The search last sent to (or read from) the address bar.
  const [committed, setCommitted] = useState(value);
  const timer = useRef<number | undefined>(undefined);

  // The address bar changed by other means (back button, a link): show its search. While our own
  // change is still loading, the address bar has not caught up yet, so leave the box alone.
  if (navigation.state === 'idle' && value !== committed) {
    setCommitted(value);
    setText(value);
  }

  const send = (q: string) => {
    window.clearTimeout(timer.current);
    setCommitted(q);
    onSearch(q);
  };

  const changeText = (event: ChangeEvent<HTMLInputElement>) => {
    const next = event.target.value;
    setText(next);
    window.clearTimeout(timer.current);
    timer.current = window.setTimeout(() => send(next.trim()), searchDelayMs);
  };

  return (
    <form
      role="search"
      className="min-w-0 flex-1 basis-64"
      onSubmit={(event) => {
        event.preventDefault();
        send(text.trim());
      }}
    >
      <label htmlFor="site-search" className="mb-1 block text-sm font-medium">
        Search sites
      </label>
      <div className="relative">
        <Search
          aria-hidden="true"
          className="pointer-events-none absolute top-1/2 left-2.5 size-4 -translate-y-1/2 text-ink-muted"
        />
        <input
          id="site-search"
          type="search"
          value={text}
          onChange={changeText}
          aria-describedby="site-search-hint"
          className={inputClassName({ className: 'pl-8' })}
          autoComplete="off"
        />
      </div>
      <p id="site-search-hint" className="mt-1 text-xs text-ink-muted">
        Reference, name, address, town or postcode.
      </p>
    </form>
  );
}

type FilterSelectProps = {
  label: string;
  value: string | number | undefined;
  onChange: (event: ChangeEvent<HTMLSelectElement>) => void;
  children: ReactNode;
};

/** One of the list's filters; its first option, with an empty value, means "no filter". */
function FilterSelect({ label, value, onChange, children }: FilterSelectProps) {
  return (
    <label className="block text-sm font-medium">
      <span className="mb-1 block">{label}</span>
      <select className={selectClassName()} value={value ?? ''} onChange={onChange}>
        {children}
      </select>
    </label>
  );
}

export function SiteListFilterBar({
  filters,
  engineers,
  currentUserId,
  onChange,
}: SiteListFiltersProps) {
  const hasFilters = Boolean(
    filters.q || filters.grade || filters.urnStatus || filters.monitored || filters.engineerId,
  );
  const select = (name: keyof FilterChange) => (event: ChangeEvent<HTMLSelectElement>) => {
    const value = event.target.value;
    onChange({ [name]: value === '' ? undefined : name === 'grade' ? Number(value) : value });
  };

  return (
    <div className="flex flex-wrap items-start gap-x-4 gap-y-3 px-4 py-4 md:px-5">
      <SearchBox value={filters.q ?? ''} onSearch={(q) => onChange({ q: q || undefined })} />
      <div className="grid flex-[2_1_32rem] grid-cols-2 gap-x-4 gap-y-3 sm:grid-cols-4">
        <FilterSelect label="Grade" value={filters.grade} onChange={select('grade')}>
          <option value="">Any grade</option>
          {GRADES.map((grade) => (
            <option key={grade} value={grade}>
              Grade {grade}
            </option>
          ))}
        </FilterSelect>
        <FilterSelect label="URN status" value={filters.urnStatus} onChange={select('urnStatus')}>
          <option value="">Any status</option>
          {URN_STATUSES.map((status) => (
            <option key={status} value={status}>
              {URN_STATUS_LABELS[status]}
            </option>
          ))}
        </FilterSelect>
        <FilterSelect label="Monitored" value={filters.monitored} onChange={select('monitored')}>
          <option value="">Either</option>
          <option value="yes">Monitored</option>
          <option value="no">Not monitored</option>
        </FilterSelect>
        <FilterSelect label="Engineer" value={filters.engineerId} onChange={select('engineerId')}>
          <option value="">Any engineer</option>
          {engineers.map((engineer) => (
            <option key={engineer.id} value={engineer.id}>
              {engineer.displayName}
              {engineer.id === currentUserId ? ' (you)' : ''}
            </option>
          ))}
        </FilterSelect>
      </div>
      {hasFilters ? (
        <Button
          variant="secondary"
          className="self-end sm:mb-5"
          onClick={() =>
            onChange({
              q: undefined,
              grade: undefined,
              urnStatus: undefined,
              monitored: undefined,
              engineerId: undefined,
            })
          }
        >
          <X aria-hidden="true" className="size-4" />
          Clear filters
        </Button>
      ) : null}
    </div>
  );
}
