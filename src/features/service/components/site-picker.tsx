import { Search } from 'lucide-react';
import { useEffect, useId, useState, type KeyboardEvent } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';

import { FormField } from '@/components/ui/form-field';
import { inputClassName, selectClassName } from '@/components/ui/form-styles';
import { LoadingStatus } from '@/components/ui/loading-status';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { SITE_CHOICES_PAGE_SIZE, useSiteChoices } from '@/features/service/api/get-site-choices';
import { siteChoiceOf, type SiteChoice } from '@/features/service/utils/site-choice';
import type { BookVisitFormValues } from '@/features/service/utils/visit-form-values';

// Long enough that a word is typed before the list is asked for it, short enough to feel live.
const SEARCH_DELAY_MS = 300;

/**
 * A search box over the company's sites (the sites list API) and a list of what it finds. The
 * chosen site stays chosen while the search changes, so it is never dropped without a word.
 */
export function SitePicker({ presetSite }: { presetSite?: SiteChoice }) {
  const searchId = useId();
  const {
    register,
    control,
    formState: { errors },
  } = useFormContext<BookVisitFormValues>();
  const [text, setText] = useState('');
  const [search, setSearch] = useState('');
  const [chosen, setChosen] = useState<SiteChoice | undefined>(presetSite);
  const [shownPreset, setShownPreset] = useState(presetSite);
  const choices = useSiteChoices(search);

  // Opened again for another site (from the overdue list): that site becomes the chosen one.
  if (presetSite !== shownPreset) {
    setShownPreset(presetSite);
    if (presetSite) setChosen(presetSite);
  }

  useEffect(() => {
    const timer = window.setTimeout(() => setSearch(text.trim()), SEARCH_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [text]);

  // Enter in the search box searches at once rather than sending the booking half-filled.
  const searchNow = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key !== 'Enter') return;
    event.preventDefault();
    setSearch(text.trim());
  };

  const siteId = useWatch({ control, name: 'siteId' });
  const found = (choices.data?.items ?? []).map(siteChoiceOf);
  const options =
    chosen && chosen.id === siteId && !found.some((site) => site.id === chosen.id)
      ? [chosen, ...found]
      : found;
  const total = choices.data?.total ?? 0;
  const siteField = register('siteId', {
    onChange: (event: { target: { value: string } }) =>
      setChosen(options.find((site) => site.id === event.target.value)),
  });

  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <div>
        <label htmlFor={searchId} className="mb-1 block text-sm font-medium">
          Find a site
        </label>
        <div className="relative">
          <Search
            aria-hidden="true"
            className="pointer-events-none absolute top-1/2 left-2.5 size-4 -translate-y-1/2 text-ink-muted"
          />
          <input
            id={searchId}
            type="search"
            value={text}
            onChange={(event) => setText(event.target.value)}
            onKeyDown={searchNow}
            aria-describedby={`${searchId}-hint`}
            autoComplete="off"
            className={inputClassName({ className: 'pl-8' })}
          />
        </div>
        <p id={`${searchId}-hint`} className="mt-1 text-xs text-ink-muted">
          Reference, name, address, town or postcode.
        </p>
      </div>
      <FormField
        label="Site"
        hint={
          !choices.data
            ? undefined
            : total > SITE_CHOICES_PAGE_SIZE
              ? `The first ${SITE_CHOICES_PAGE_SIZE} of ${total} sites; search to narrow them.`
              : search
                ? `${total === 1 ? '1 site matches' : `${total} sites match`} the search.`
                : `All ${total} of your company’s sites.`
        }
        error={errors.siteId?.message}
      >
        {(fieldProps) => (
          <select {...fieldProps} {...siteField} className={selectClassName()}>
            <option value="">Choose a site</option>
            {options.map((site) => (
              <option key={site.id} value={site.id}>
                {site.label}
              </option>
            ))}
          </select>
        )}
      </FormField>
      {choices.isPending ? <LoadingStatus label="Finding sites" /> : null}
      {choices.isError ? (
        <ProblemAlert
          className="sm:col-span-2"
          error={choices.error}
          title="The sites could not be searched."
        />
      ) : null}
    </div>
  );
}
