import { useFormContext, useWatch, type Control } from 'react-hook-form';

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
import {
  DenseNumberField,
  DenseSelectField,
  DenseTextField,
  RequiredChoiceOptions,
} from '@/components/forms/dense-fields';
import { EditableRow, type EditableRowPlace } from '@/components/forms/editable-row';
import { editableRowIds } from '@/components/forms/editable-row-ids';
import { AreaField, GradeAndCurrentFields } from '@/components/forms/fitted-equipment-fields';
import { labelInRow } from '@/components/forms/row-label';
import { FieldErrorMessage } from '@/components/ui/form-field';
import { checkboxClassName } from '@/components/ui/form-styles';
import { CoreMapEditor } from '@/features/zones/components/core-map-editor';
import { ZoneLoopCheck } from '@/features/zones/components/zone-loop-check';
import { resistorsFor } from '@/features/zones/utils/expected-readings';
import { parseOhms } from '@/features/zones/utils/ohms';
import type { ZoneScheduleFormValues } from '@/features/zones/utils/zone-form-values';
import { ZONE_ROW_KIND, zoneRowName } from '@/features/zones/utils/zone-row-names';
import { numberOrNull, numberOrUndefined } from '@/lib/form-values';
import type { LoopSettings } from '@/lib/loop-readings';

type ZoneRowProps = EditableRowPlace & {
  areas: ZoneSchedule['areas'];
  /** The system's resistor tolerance and cable core, which every zone's bands depend on. */
  loopSettings: LoopSettings;
};

const CORES_PER_LEG = [1, 2, 3, 4] as const;

type ResistorFieldProps = {
  resistor: 'Tamper' | 'Alarm';
  row: number;
  /** Whether the loop's wiring has this resistor at all. */
  isTaken: boolean;
  error?: string;
  control: Control<ZoneScheduleFormValues>;
  name: `zones.${number}.tamperOhms` | `zones.${number}.alarmOhms`;
};

/**
 * A resistor value, typed in ohms or resistor code (2k2). A wiring without this resistor shows
 * that in words where the field would be, so the row keeps its shape and nothing seems missing.
 */
function ResistorField({ resistor, row, isTaken, error, control, name }: ResistorFieldProps) {
  if (!isTaken) {
    return (
      <div className="min-w-0">
        <p className="mb-0.5 text-xs font-medium text-ink-muted">{resistor} resistor</p>
        <p className="flex min-h-9 items-center text-xs text-ink-muted">None on this wiring</p>
        <FieldErrorMessage message={error} compact />
      </div>
    );
  }
  return (
    <DenseTextField
      label={`${resistor} resistor (Ω)`}
      accessibleLabel={labelInRow(`${resistor} resistor (Ω)`, row)}
      error={error}
      className="xl:col-span-2"
      control={control}
      name={name}
      registerOptions={{ setValueAs: parseOhms }}
      code
    />
  );
}

/**
 * One zone of the schedule as a compact block of fields. Every control's accessible name carries
 * the row ("Location, row 3"), so a screen reader can tell one row's fields from the next.
 */
export function ZoneRow({ areas, loopSettings, ...place }: ZoneRowProps) {
  const { index, rowKey } = place;
  const {
    control,
    register,
    setValue,
    formState: { errors },
  } = useFormContext<ZoneScheduleFormValues>();
  const [number, location, loopWiring, tamperOhms, alarmOhms, cableMetres, coresPerLeg] = useWatch({
    control,
    name: [
      `zones.${index}.number`,
      `zones.${index}.location`,
      `zones.${index}.loopWiring`,
      `zones.${index}.tamperOhms`,
      `zones.${index}.alarmOhms`,
      `zones.${index}.cableMetres`,
      `zones.${index}.coresPerLeg`,
    ],
  });
  const row = index + 1;
  const rowErrors = errors.zones?.[index];
  const resistors = resistorsFor(loopWiring);
  const rowPath = `zones.${index}` as const;

  return (
    <EditableRow
      place={place}
      rowKind={ZONE_ROW_KIND}
      itemName={zoneRowName(number, row)}
      heading={
        <>
          {typeof number === 'number' && Number.isInteger(number) ? (
            <>
              Zone <span className="font-mono">{number}</span>
            </>
          ) : (
            `Zone in row ${row}`
          )}
          {location ? <span className="font-normal text-ink-muted">: {location}</span> : null}
          <span className="sr-only">, row {row}</span>
        </>
      }
    >
      <DenseNumberField
        label="Zone number"
        accessibleLabel={labelInRow('Zone number', row)}
        error={rowErrors?.number?.message}
        className="xl:col-span-2"
        control={control}
        name={`${rowPath}.number`}
        registerOptions={{ setValueAs: numberOrUndefined }}
        min={1}
        max={999}
        inputMode="numeric"
      />
      <DenseTextField
        label="Location"
        accessibleLabel={labelInRow('Location', row)}
        error={rowErrors?.location?.message}
        className="sm:col-span-3 xl:col-span-3"
        control={control}
        name={`${rowPath}.location`}
      />
      <DenseSelectField
        label="Zone type"
        accessibleLabel={labelInRow('Zone type', row)}
        error={rowErrors?.zoneType?.message}
        className="col-span-2 xl:col-span-2"
        control={control}
        name={`${rowPath}.zoneType`}
      >
        <RequiredChoiceOptions values={ZONE_TYPES} labels={ZONE_TYPE_LABELS} />
      </DenseSelectField>
      <DenseSelectField
        label="Detector kind"
        accessibleLabel={labelInRow('Detector kind', row)}
        error={rowErrors?.detectorKind?.message}
        className="col-span-2 xl:col-span-3"
        control={control}
        name={`${rowPath}.detectorKind`}
      >
        <RequiredChoiceOptions values={DETECTOR_KINDS} labels={DETECTOR_KIND_LABELS} />
      </DenseSelectField>
      <DenseTextField
        label="Detector model"
        accessibleLabel={labelInRow('Detector model', row)}
        error={rowErrors?.detectorModel?.message}
        className="col-span-2 xl:col-span-2"
        control={control}
        name={`${rowPath}.detectorModel`}
      />

      <DenseSelectField
        label="Loop wiring"
        accessibleLabel={labelInRow('Loop wiring', row)}
        error={rowErrors?.loopWiring?.message}
        className="col-span-2 xl:col-span-3"
        control={control}
        name={`${rowPath}.loopWiring`}
        registerOptions={{
          // Values the new wiring does not take are cleared, not left to fail the check.
          onChange: (event: { target: { value: string } }) => {
            const needs = resistorsFor(event.target.value as LoopWiring);
            if (!needs.tamper) setValue(`${rowPath}.tamperOhms`, null);
            if (!needs.alarm) setValue(`${rowPath}.alarmOhms`, null);
          },
        }}
      >
        <RequiredChoiceOptions values={LOOP_WIRINGS} labels={LOOP_WIRING_LABELS} />
      </DenseSelectField>
      <ResistorField
        resistor="Tamper"
        row={row}
        isTaken={resistors.tamper}
        error={rowErrors?.tamperOhms?.message}
        control={control}
        name={`${rowPath}.tamperOhms`}
      />
      <ResistorField
        resistor="Alarm"
        row={row}
        isTaken={resistors.alarm}
        error={rowErrors?.alarmOhms?.message}
        control={control}
        name={`${rowPath}.alarmOhms`}
      />
      <DenseNumberField
        label="Cable run (m)"
        accessibleLabel={labelInRow('Cable run (m)', row)}
        error={rowErrors?.cableMetres?.message}
        className="xl:col-span-2"
        control={control}
        name={`${rowPath}.cableMetres`}
        registerOptions={{ setValueAs: numberOrNull }}
        min={0}
        max={2000}
        step="any"
        inputMode="decimal"
      />
      <DenseSelectField
        label="Cores per leg"
        accessibleLabel={labelInRow('Cores per leg', row)}
        error={rowErrors?.coresPerLeg?.message}
        className="xl:col-span-1"
        control={control}
        name={`${rowPath}.coresPerLeg`}
        registerOptions={{ setValueAs: numberOrUndefined }}
      >
        {CORES_PER_LEG.map((cores) => (
          <option key={cores} value={cores}>
            {cores}
          </option>
        ))}
      </DenseSelectField>
      <ZoneLoopCheck
        wiring={loopWiring}
        tamperOhms={tamperOhms}
        alarmOhms={alarmOhms}
        cableMetres={cableMetres}
        coresPerLeg={coresPerLeg}
        settings={loopSettings}
        className="col-span-2 sm:col-span-4 xl:col-span-12"
      />

      <AreaField
        rowPath={rowPath}
        row={row}
        areas={areas}
        error={rowErrors?.areaId?.message}
        className="col-span-2 xl:col-span-3"
      />
      <GradeAndCurrentFields rowPath={rowPath} row={row} errors={rowErrors} />

      <fieldset className="col-span-2 min-w-0 sm:col-span-4 xl:col-span-6">
        <legend className="mb-1 text-xs font-medium">Attributes</legend>
        <div className="grid gap-x-3 sm:grid-cols-2 xl:grid-cols-3">
          {ZONE_ATTRIBUTES.map((attribute) => (
            <label key={attribute} className="flex min-h-8 items-center gap-2 text-sm">
              <input
                type="checkbox"
                value={attribute}
                {...register(`${rowPath}.attributes`)}
                aria-label={labelInRow(ZONE_ATTRIBUTE_LABELS[attribute], row)}
                className={checkboxClassName}
              />
              <span aria-hidden="true">{ZONE_ATTRIBUTE_LABELS[attribute]}</span>
            </label>
          ))}
        </div>
        <FieldErrorMessage message={rowErrors?.attributes?.message} compact />
      </fieldset>
      <div className="col-span-2 min-w-0 sm:col-span-4 xl:col-span-6">
        <CoreMapEditor
          zoneIndex={index}
          row={row}
          idPrefix={editableRowIds(ZONE_ROW_KIND, rowKey).idPrefix}
        />
      </div>
    </EditableRow>
  );
}
