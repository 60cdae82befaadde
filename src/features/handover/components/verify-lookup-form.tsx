import { useState } from 'react';
import { Search } from 'lucide-react';
import { useNavigate } from 'react-router-dom';

import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { touchInputClassName } from '@/components/ui/touch-field-styles';
import { paths } from '@/config/paths';
import { normalisePackNumber } from '@/features/handover/utils/pack-numbers';

type VerifyLookupFormProps = { defaultValue?: string };

/** Type a pack number (it is on the cover and every page's foot) to open its verification page. */
export function VerifyLookupForm({ defaultValue = '' }: VerifyLookupFormProps) {
  const navigate = useNavigate();
  const [typed, setTyped] = useState(defaultValue);
  const [error, setError] = useState<string | undefined>();

  return (
    <form
      noValidate
      aria-label="Find a pack"
      className="grid gap-4"
      onSubmit={(event) => {
        event.preventDefault();
        const packNumber = normalisePackNumber(typed);
        if (!packNumber) {
          setError(
            'A pack number looks like HW-000042-R1: letters, six digits, then R and the revision.',
          );
          event.currentTarget.querySelector('input')?.focus();
          return;
        }
        setError(undefined);
        void navigate(paths.verify.pack.getHref(packNumber));
      }}
    >
      <FormField
        label="Pack number"
        hint="On the pack’s cover and at the foot of every page, for example HW-000042-R1."
        error={error}
      >
        {(fieldProps) => (
          <input
            {...fieldProps}
            name="packNumber"
            type="text"
            value={typed}
            onChange={(event) => setTyped(event.target.value)}
            autoComplete="off"
            autoCapitalize="characters"
            spellCheck={false}
            className={touchInputClassName({
              invalid: Boolean(error),
              className: 'max-w-xs font-mono uppercase',
            })}
          />
        )}
      </FormField>
      <div>
        <Button type="submit" size="lg">
          <Search aria-hidden="true" className="size-5" />
          Check this pack
        </Button>
      </div>
    </form>
  );
}
