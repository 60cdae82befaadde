import { useFormContext, type FieldError } from 'react-hook-form';

import { GRADES, ROMAN_CLASSES } from '@server/schema/fields';
import { DenseNumberField, DenseSelectField } from '@/components/forms/dense-fields';
import { labelInRow } from '@/components/forms/row-label';
import { numberOrNull, textOrNull } from '@/lib/form-values';

/*
 * Fields that every fitted part records alike, whether a zone's detector or a device: the area
 * it is placed in, its EN 50131 grade and environmental class, and the currents it draws for the
 * power budget. They register under the row's own path, as the zone and device schemas name them
 * the same, so one form's row and the other's share this markup.
 */

type FittedArea = { id: string; number: number; name: string };

type AreaFieldProps = {
  /** Where the row sits in the form: "zones.3", "devices.0". */
  rowPath: string;
  row: number;
  areas: readonly FittedArea[];
  error?: string;
  className?: string;
};

export function AreaField({ rowPath, row, areas, error, className }: AreaFieldProps) {
  const { control } = useFormContext();
  return (
    <DenseSelectField
      label="Area"
      accessibleLabel={labelInRow('Area', row)}
      error={error}
      className={className}
      control={control}
      name={`${rowPath}.areaId`}
      registerOptions={{ setValueAs: textOrNull }}
    >
      <option value="">No area</option>
      {areas.map((area) => (
        <option key={area.id} value={area.id}>
          {`Area ${area.number}: ${area.name}`}
        </option>
      ))}
    </DenseSelectField>
  );
}

type GradeAndCurrentFieldsProps = {
  /** Where the row sits in the form: "zones.3", "devices.0". */
  rowPath: string;
  row: number;
  errors?: {
    grade?: FieldError;
    environmentalClass?: FieldError;
    quiescentMa?: FieldError;
    alarmMa?: FieldError;
  };
};

export function GradeAndCurrentFields({ rowPath, row, errors }: GradeAndCurrentFieldsProps) {
  const { control } = useFormContext();
  return (
    <>
      <DenseSelectField
        label="Grade"
        accessibleLabel={labelInRow('Grade', row)}
        error={errors?.grade?.message}
        className="xl:col-span-2"
        control={control}
        name={`${rowPath}.grade`}
        registerOptions={{ setValueAs: numberOrNull }}
      >
        <option value="">Not recorded</option>
        {GRADES.map((grade) => (
          <option key={grade} value={grade}>
            Grade {grade}
          </option>
        ))}
      </DenseSelectField>
      <DenseSelectField
        label="Environmental class"
        accessibleLabel={labelInRow('Environmental class', row)}
        error={errors?.environmentalClass?.message}
        className="xl:col-span-2"
        control={control}
        name={`${rowPath}.environmentalClass`}
        registerOptions={{ setValueAs: numberOrNull }}
      >
        <option value="">Not recorded</option>
        {ROMAN_CLASSES.map((roman, classIndex) => (
          <option key={roman} value={classIndex + 1}>
            Class {roman}
          </option>
        ))}
      </DenseSelectField>
      <DenseNumberField
        label="Quiescent (mA)"
        accessibleLabel={labelInRow('Quiescent current (mA)', row)}
        error={errors?.quiescentMa?.message}
        className="xl:col-span-2"
        control={control}
        name={`${rowPath}.quiescentMa`}
        registerOptions={{ setValueAs: numberOrNull }}
        step="0.1"
        min={0}
        inputMode="decimal"
      />
      <DenseNumberField
        label="In alarm (mA)"
        accessibleLabel={labelInRow('In alarm (mA)', row)}
        error={errors?.alarmMa?.message}
        className="xl:col-span-2"
        control={control}
        name={`${rowPath}.alarmMa`}
        registerOptions={{ setValueAs: numberOrNull }}
        step="0.1"
        min={0}
        inputMode="decimal"
      />
    </>
  );
}
