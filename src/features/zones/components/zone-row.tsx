import { useFormContext, useWatch } from 'react-hook-form';

import { GRADES, ROMAN_CLASSES } from '@server/schema/fields';
import {
  DETECTOR_KIND_LABELS,
  DETECTOR_KINDS,
  LOOP_WIRING_LABELS,
  LOOP_WIRINGS,
  ZONE_ATTRIBUTE_LABELS,
  ZONE_ATTRIBUTES,
  ZONE_TYPE_LABELS,
  ZONE_TYPES,
  type LoopWiring,
  type ZoneSchedule,
} from '@server/zones/schema';
import { FieldErrorMessage, FormField } from '@/components/ui/form-field';
import { checkboxClassName, inputClassName, selectClassName } from '@/components/ui/form-styles';
import { RowActions } from '@/components/ui/row-actions';
import { CoreMapEditor } from '@/features/zones/components/core-map-editor';
import { ExpectedReadingsNote } from '@/features/zones/components/expected-readings-note';
import { resistorsFor } from '@/features/zones/utils/expected-readings';
import { parseOhms } from '@/features/zones/utils/ohms';
import type { ZoneScheduleFormValues } from '@/features/zones/utils/zone-form-values';
import { zoneRowHeadingId, zoneRowName } from '@/features/zones/utils/zone-row-names';
import { numberOrNull, numberOrUndefined, textOrNull } from '@/lib/form-values';

type ZoneRowProps = {
  index: number;
  rowCount: number;
  /** Stable while the row moves, for ids that focus can return to. */
  rowKey: string;
  areas: ZoneSchedule['areas'];
  onMoveUp: () => void;
  onMoveDown: () => void;
  onDuplicate: () => void;
  onRemove: () => void;
};

function NotUsed({ label, reason, error }: { label: string; reason: string; error?: string }) {
  return (
    <div className="min-w-0">
      <p className="mb-0.5 text-xs font-medium text-ink-muted">{label}</p>
      <p className="flex min-h-9 items-center text-xs text-ink-muted">{reason}</p>
      <FieldErrorMessage message={error} compact />
    </div>
  );
}

/**
 * One zone of the schedule as a compact block of fields. Every control's accessible name carries
 * the row ("Location, row 3"), so a screen reader can tell one row's fields from the next.
 */
export function ZoneRow({
  index,
  rowCount,
  rowKey,
  areas,
  onMoveUp,
  onMoveDown,
  onDuplicate,
  onRemove,
}: ZoneRowProps) {
  const {
    control,
    register,
    setValue,
    formState: { errors },
  } = useFormContext<ZoneScheduleFormValues>();
  const [number, location, loopWiring, tamperOhms, alarmOhms] = useWatch({
    control,
    name: [
      `zones.${index}.number`,
      `zones.${index}.location`,
      `zones.${index}.loopWiring`,
      `zones.${index}.tamperOhms`,
      `zones.${index}.alarmOhms`,
    ],
  });
  const row = index + 1;
  const rowErrors = errors.zones?.[index];
  const resistors = resistorsFor(loopWiring);
  const name = zoneRowName(number, row);
  const label = (field: string) => `${field}, row ${row}`;
  const path = <Field extends string>(field: Field) => `zones.${index}.${field}` as const;

  return (
    <li className="rounded-lg border border-hairline bg-white">
      <div role="group" aria-labelledby={zoneRowHeadingId(rowKey)}>
        <div className="flex flex-wrap items-center justify-between gap-2 border-b border-hairline bg-paper/60 px-3 py-2">
          <h3 id={zoneRowHeadingId(rowKey)} tabIndex={-1} className="min-w-0 text-sm font-semibold">
            {typeof number === 'number' && Number.isInteger(number) ? (
              <>
                Zone <span className="font-mono">{number}</span>
              </>
            ) : (
              `Zone in row ${row}`
            )}
            {location ? <span className="font-normal text-ink-muted">: {location}</span> : null}
            <span className="sr-only">, row {row}</span>
          </h3>
          <RowActions
            itemName={name}
            idPrefix={`zone-${rowKey}`}
            isFirst={index === 0}
            isLast={index === rowCount - 1}
            onMoveUp={onMoveUp}
            onMoveDown={onMoveDown}
            onDuplicate={onDuplicate}
            onRemove={onRemove}
          />
        </div>

        <div className="grid grid-cols-2 gap-x-3 gap-y-3 p-3 sm:grid-cols-4 xl:grid-cols-12">
          <FormField
            label="Zone number"
            accessibleLabel={label('Zone number')}
            compact
            error={rowErrors?.number?.message}
            className="xl:col-span-2"
          >
            {(field) => (
              <input
                {...field}
                {...register(path('number'), { setValueAs: numberOrUndefined })}
                type="number"
                min={1}
                max={999}
                inputMode="numeric"
                className={inputClassName({ size: 'dense', mono: true })}
              />
            )}
          </FormField>
          <FormField
            label="Location"
            accessibleLabel={label('Location')}
            compact
            error={rowErrors?.location?.message}
            className="sm:col-span-3 xl:col-span-3"
          >
            {(field) => (
              <input
                {...field}
                {...register(path('location'))}
                className={inputClassName({ size: 'dense' })}
                autoComplete="off"
              />
            )}
          </FormField>
          <FormField
            label="Zone type"
            accessibleLabel={label('Zone type')}
            compact
            error={rowErrors?.zoneType?.message}
            className="col-span-2 xl:col-span-2"
          >
            {(field) => (
              <select
                {...field}
                {...register(path('zoneType'))}
                className={selectClassName({ size: 'dense' })}
              >
                <option value="" disabled>
                  Choose…
                </option>
                {ZONE_TYPES.map((type) => (
                  <option key={type} value={type}>
                    {ZONE_TYPE_LABELS[type]}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <FormField
            label="Detector kind"
            accessibleLabel={label('Detector kind')}
            compact
            error={rowErrors?.detectorKind?.message}
            className="col-span-2 xl:col-span-3"
          >
            {(field) => (
              <select
                {...field}
                {...register(path('detectorKind'))}
                className={selectClassName({ size: 'dense' })}
              >
                <option value="" disabled>
                  Choose…
                </option>
                {DETECTOR_KINDS.map((kind) => (
                  <option key={kind} value={kind}>
                    {DETECTOR_KIND_LABELS[kind]}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <FormField
            label="Detector model"
            accessibleLabel={label('Detector model')}
            compact
            error={rowErrors?.detectorModel?.message}
            className="col-span-2 xl:col-span-2"
          >
            {(field) => (
              <input
                {...field}
                {...register(path('detectorModel'))}
                className={inputClassName({ size: 'dense' })}
                autoComplete="off"
              />
            )}
          </FormField>

          <FormField
            label="Loop wiring"
            accessibleLabel={label('Loop wiring')}
            compact
            error={rowErrors?.loopWiring?.message}
            className="col-span-2 xl:col-span-3"
          >
            {(field) => (
              <select
                {...field}
                {...register(path('loopWiring'), {
                  // Values the new wiring does not take are cleared, not left to fail the check.
                  onChange: (event: { target: { value: string } }) => {
                    const needs = resistorsFor(event.target.value as LoopWiring);
                    if (!needs.tamper) setValue(path('tamperOhms'), null);
                    if (!needs.alarm) setValue(path('alarmOhms'), null);
                  },
                })}
                className={selectClassName({ size: 'dense' })}
              >
                <option value="" disabled>
                  Choose…
                </option>
                {LOOP_WIRINGS.map((wiring) => (
                  <option key={wiring} value={wiring}>
                    {LOOP_WIRING_LABELS[wiring]}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          {resistors.tamper ? (
            <FormField
              label="Tamper resistor (Ω)"
              accessibleLabel={label('Tamper resistor (Ω)')}
              compact
              error={rowErrors?.tamperOhms?.message}
              className="xl:col-span-2"
            >
              {(field) => (
                <input
                  {...field}
                  {...register(path('tamperOhms'), { setValueAs: parseOhms })}
                  className={inputClassName({ size: 'dense', mono: true })}
                  autoComplete="off"
                  spellCheck={false}
                />
              )}
            </FormField>
          ) : (
            <NotUsed
              label="Tamper resistor"
              reason="None on this wiring"
              error={rowErrors?.tamperOhms?.message}
            />
          )}
          {resistors.alarm ? (
            <FormField
              label="Alarm resistor (Ω)"
              accessibleLabel={label('Alarm resistor (Ω)')}
              compact
              error={rowErrors?.alarmOhms?.message}
              className="xl:col-span-2"
            >
              {(field) => (
                <input
                  {...field}
                  {...register(path('alarmOhms'), { setValueAs: parseOhms })}
                  className={inputClassName({ size: 'dense', mono: true })}
                  autoComplete="off"
                  spellCheck={false}
                />
              )}
            </FormField>
          ) : (
            <NotUsed
              label="Alarm resistor"
              reason="None on this wiring"
              error={rowErrors?.alarmOhms?.message}
            />
          )}
          <ExpectedReadingsNote
            wiring={loopWiring}
            tamperOhms={tamperOhms}
            alarmOhms={alarmOhms}
            className="col-span-2 sm:col-span-4 xl:col-span-5"
          />

          <FormField
            label="Area"
            accessibleLabel={label('Area')}
            compact
            error={rowErrors?.areaId?.message}
            className="col-span-2 xl:col-span-3"
          >
            {(field) => (
              <select
                {...field}
                {...register(path('areaId'), { setValueAs: textOrNull })}
                className={selectClassName({ size: 'dense' })}
              >
                <option value="">No area</option>
                {areas.map((area) => (
                  <option key={area.id} value={area.id}>
                    {`Area ${area.number}: ${area.name}`}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <FormField
            label="Grade"
            accessibleLabel={label('Grade')}
            compact
            error={rowErrors?.grade?.message}
            className="xl:col-span-2"
          >
            {(field) => (
              <select
                {...field}
                {...register(path('grade'), { setValueAs: numberOrNull })}
                className={selectClassName({ size: 'dense' })}
              >
                <option value="">Not recorded</option>
                {GRADES.map((grade) => (
                  <option key={grade} value={grade}>
                    Grade {grade}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <FormField
            label="Environmental class"
            accessibleLabel={label('Environmental class')}
            compact
            error={rowErrors?.environmentalClass?.message}
            className="xl:col-span-2"
          >
            {(field) => (
              <select
                {...field}
                {...register(path('environmentalClass'), { setValueAs: numberOrNull })}
                className={selectClassName({ size: 'dense' })}
              >
                <option value="">Not recorded</option>
                {ROMAN_CLASSES.map((roman, classIndex) => (
                  <option key={roman} value={classIndex + 1}>
                    Class {roman}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <FormField
            label="Quiescent (mA)"
            accessibleLabel={label('Quiescent current (mA)')}
            compact
            error={rowErrors?.quiescentMa?.message}
            className="xl:col-span-2"
          >
            {(field) => (
              <input
                {...field}
                {...register(path('quiescentMa'), { setValueAs: numberOrNull })}
                type="number"
                step="0.1"
                min={0}
                inputMode="decimal"
                className={inputClassName({ size: 'dense', mono: true })}
              />
            )}
          </FormField>
          <FormField
            label="In alarm (mA)"
            accessibleLabel={label('In alarm (mA)')}
            compact
            error={rowErrors?.alarmMa?.message}
            className="xl:col-span-2"
          >
            {(field) => (
              <input
                {...field}
                {...register(path('alarmMa'), { setValueAs: numberOrNull })}
                type="number"
                step="0.1"
                min={0}
                inputMode="decimal"
                className={inputClassName({ size: 'dense', mono: true })}
              />
            )}
          </FormField>

          <fieldset className="col-span-2 min-w-0 sm:col-span-4 xl:col-span-6">
            <legend className="mb-1 text-xs font-medium">Attributes</legend>
            <div className="grid gap-x-3 sm:grid-cols-2 xl:grid-cols-3">
              {ZONE_ATTRIBUTES.map((attribute) => (
                <label key={attribute} className="flex min-h-8 items-center gap-2 text-sm">
                  <input
                    type="checkbox"
                    value={attribute}
                    {...register(path('attributes'))}
                    aria-label={label(ZONE_ATTRIBUTE_LABELS[attribute])}
                    className={checkboxClassName}
                  />
                  <span aria-hidden="true">{ZONE_ATTRIBUTE_LABELS[attribute]}</span>
                </label>
              ))}
            </div>
            <FieldErrorMessage message={rowErrors?.attributes?.message} compact />
          </fieldset>
          <div className="col-span-2 min-w-0 sm:col-span-4 xl:col-span-6">
            <CoreMapEditor zoneIndex={index} row={row} idPrefix={`zone-${rowKey}`} />
          </div>
        </div>
      </div>
    </li>
  );
}
