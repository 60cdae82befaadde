import { useFormContext, useWatch } from 'react-hook-form';

import { DEVICE_KIND_LABELS, DEVICE_KINDS } from '@server/devices/schema';
import { GRADES, ROMAN_CLASSES } from '@server/schema/fields';
import { FormField } from '@/components/ui/form-field';
import { inputClassName, selectClassName } from '@/components/ui/form-styles';
import { RowActions } from '@/components/ui/row-actions';
import {
  deviceRowHeadingId,
  type DeviceArea,
  type DeviceListFormValues,
} from '@/features/devices/utils/device-form-values';
import { numberOrNull, textOrNull } from '@/lib/form-values';

type DeviceRowProps = {
  index: number;
  rowCount: number;
  rowKey: string;
  areas: readonly DeviceArea[];
  onMoveUp: () => void;
  onMoveDown: () => void;
  onDuplicate: () => void;
  onRemove: () => void;
};

export function DeviceRow({
  index,
  rowCount,
  rowKey,
  areas,
  onMoveUp,
  onMoveDown,
  onDuplicate,
  onRemove,
}: DeviceRowProps) {
  const {
    control,
    register,
    formState: { errors },
  } = useFormContext<DeviceListFormValues>();
  const [kind, location] = useWatch({
    control,
    name: [`devices.${index}.kind`, `devices.${index}.location`],
  });
  const row = index + 1;
  const rowErrors = errors.devices?.[index];
  const label = (field: string) => `${field}, row ${row}`;
  const path = <Field extends string>(field: Field) => `devices.${index}.${field}` as const;

  return (
    <li className="rounded-lg border border-hairline bg-white">
      <div role="group" aria-labelledby={deviceRowHeadingId(rowKey)}>
        <div className="flex flex-wrap items-center justify-between gap-2 border-b border-hairline bg-paper/60 px-3 py-2">
          <h3
            id={deviceRowHeadingId(rowKey)}
            tabIndex={-1}
            className="min-w-0 text-sm font-semibold"
          >
            Device {row}
            {kind ? <span className="font-normal">: {DEVICE_KIND_LABELS[kind]}</span> : null}
            {location ? <span className="font-normal text-ink-muted">, {location}</span> : null}
          </h3>
          <RowActions
            itemName={`device ${row}`}
            idPrefix={`device-${rowKey}`}
            isFirst={index === 0}
            isLast={index === rowCount - 1}
            onMoveUp={onMoveUp}
            onMoveDown={onMoveDown}
            onDuplicate={onDuplicate}
            onRemove={onRemove}
          />
        </div>
        <div className="grid grid-cols-2 gap-3 p-3 sm:grid-cols-4 xl:grid-cols-12">
          <FormField
            label="Device kind"
            accessibleLabel={label('Device kind')}
            compact
            error={rowErrors?.kind?.message}
            className="col-span-2 xl:col-span-3"
          >
            {(field) => (
              <select
                {...field}
                {...register(path('kind'))}
                className={selectClassName({ size: 'dense' })}
              >
                <option value="" disabled>
                  Choose…
                </option>
                {DEVICE_KINDS.map((deviceKind) => (
                  <option key={deviceKind} value={deviceKind}>
                    {DEVICE_KIND_LABELS[deviceKind]}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <FormField
            label="Location"
            accessibleLabel={label('Location')}
            compact
            error={rowErrors?.location?.message}
            className="col-span-2 xl:col-span-5"
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
            label="Model"
            accessibleLabel={label('Model')}
            compact
            error={rowErrors?.model?.message}
            className="col-span-2 xl:col-span-4"
          >
            {(field) => (
              <input
                {...field}
                {...register(path('model'))}
                className={inputClassName({ size: 'dense' })}
                autoComplete="off"
              />
            )}
          </FormField>
          <FormField
            label="Area"
            accessibleLabel={label('Area')}
            compact
            error={rowErrors?.areaId?.message}
            className="col-span-2 xl:col-span-4"
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
        </div>
      </div>
    </li>
  );
}
