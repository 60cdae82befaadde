import { Plus, X } from 'lucide-react';
import { useFieldArray, useFormContext } from 'react-hook-form';

import { CORE_COLOURS } from '@server/zones/schema';
import { Button } from '@/components/ui/button';
import { FieldErrorMessage, FormField } from '@/components/ui/form-field';
import { inputClassName, selectClassName } from '@/components/ui/form-styles';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';
import type { ZoneScheduleFormValues } from '@/features/zones/utils/zone-form-values';

const MAX_CORES = 12;

const colourName = (colour: string) => colour.charAt(0).toUpperCase() + colour.slice(1);

type CoreMapEditorProps = { zoneIndex: number; row: number; idPrefix: string };

/** Which cable core lands on which terminal: the record the next engineer reaches for. */
export function CoreMapEditor({ zoneIndex, row, idPrefix }: CoreMapEditorProps) {
  const {
    control,
    register,
    formState: { errors },
  } = useFormContext<ZoneScheduleFormValues>();
  const { fields, append, remove } = useFieldArray({
    control,
    name: `zones.${zoneIndex}.coreMap`,
  });
  const focusAfterRender = useFocusAfterRender();
  const coreErrors = errors.zones?.[zoneIndex]?.coreMap;
  const addId = `${idPrefix}-add-core`;

  return (
    <fieldset className="min-w-0">
      <legend className="mb-1 text-xs font-medium">Cores to terminals</legend>
      {fields.length === 0 ? (
        <p className="mb-2 text-xs text-ink-muted">No cores recorded.</p>
      ) : (
        <ol className="mb-2 grid gap-2">
          {fields.map((field, coreIndex) => {
            const core = coreIndex + 1;
            const removeId = `${idPrefix}-core-${field.id}-remove`;
            return (
              <li
                key={field.id}
                className="grid grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto] items-start gap-2"
              >
                <FormField
                  label="Core colour"
                  accessibleLabel={`Core colour, row ${row}, core ${core}`}
                  compact
                  error={coreErrors?.[coreIndex]?.colour?.message}
                >
                  {(control) => (
                    <select
                      {...control}
                      {...register(`zones.${zoneIndex}.coreMap.${coreIndex}.colour`)}
                      className={selectClassName({ size: 'dense' })}
                    >
                      {CORE_COLOURS.map((colour) => (
                        <option key={colour} value={colour}>
                          {colourName(colour)}
                        </option>
                      ))}
                    </select>
                  )}
                </FormField>
                <FormField
                  label="Terminal"
                  accessibleLabel={`Terminal, row ${row}, core ${core}`}
                  compact
                  error={coreErrors?.[coreIndex]?.terminal?.message}
                >
                  {(control) => (
                    <input
                      {...control}
                      {...register(`zones.${zoneIndex}.coreMap.${coreIndex}.terminal`)}
                      className={inputClassName({ size: 'dense', mono: true })}
                      autoComplete="off"
                      spellCheck={false}
                    />
                  )}
                </FormField>
                <Button
                  id={removeId}
                  variant="secondary"
                  className="mt-4.5 min-h-9 min-w-9 px-2"
                  aria-label={`Remove core ${core}, row ${row}`}
                  title="Remove this core"
                  onClick={() => {
                    remove(coreIndex);
                    const next = fields[coreIndex + 1] ?? fields[coreIndex - 1];
                    focusAfterRender(next ? `${idPrefix}-core-${next.id}-remove` : addId, addId);
                  }}
                >
                  <X aria-hidden="true" className="size-4" />
                </Button>
              </li>
            );
          })}
        </ol>
      )}
      <FieldErrorMessage message={coreErrors?.message ?? coreErrors?.root?.message} compact />
      <Button
        id={addId}
        variant="secondary"
        className="min-h-9"
        disabled={fields.length >= MAX_CORES}
        aria-label={`Add core, row ${row}`}
        onClick={() =>
          append(
            { colour: CORE_COLOURS[fields.length % CORE_COLOURS.length] ?? 'red', terminal: '' },
            { focusName: `zones.${zoneIndex}.coreMap.${fields.length}.terminal` },
          )
        }
      >
        <Plus aria-hidden="true" className="size-4" />
        Add core
      </Button>
    </fieldset>
  );
}
