import { useFormContext, useWatch } from 'react-hook-form';

import { DEVICE_KIND_LABELS, DEVICE_KINDS } from '@server/devices/schema';
import {
  DenseSelectField,
  DenseTextField,
  RequiredChoiceOptions,
} from '@/components/forms/dense-fields';
import { EditableRow, type EditableRowPlace } from '@/components/forms/editable-row';
import { AreaField, GradeAndCurrentFields } from '@/components/forms/fitted-equipment-fields';
import { labelInRow } from '@/components/forms/row-label';
import {
  DEVICE_ROW_KIND,
  type DeviceArea,
  type DeviceListFormValues,
} from '@/features/devices/utils/device-form-values';

type DeviceRowProps = EditableRowPlace & { areas: readonly DeviceArea[] };

export function DeviceRow({ areas, ...place }: DeviceRowProps) {
  const { index } = place;
  const {
    control,
    formState: { errors },
  } = useFormContext<DeviceListFormValues>();
  const [kind, location] = useWatch({
    control,
    name: [`devices.${index}.kind`, `devices.${index}.location`],
  });
  const row = index + 1;
  const rowErrors = errors.devices?.[index];
  const rowPath = `devices.${index}` as const;

  return (
    <EditableRow
      place={place}
      rowKind={DEVICE_ROW_KIND}
      itemName={`device ${row}`}
      heading={
        <>
          Device {row}
          {kind ? <span className="font-normal">: {DEVICE_KIND_LABELS[kind]}</span> : null}
          {location ? <span className="font-normal text-ink-muted">, {location}</span> : null}
        </>
      }
    >
      <DenseSelectField
        label="Device kind"
        accessibleLabel={labelInRow('Device kind', row)}
        error={rowErrors?.kind?.message}
        className="col-span-2 xl:col-span-3"
        control={control}
        name={`${rowPath}.kind`}
      >
        <RequiredChoiceOptions values={DEVICE_KINDS} labels={DEVICE_KIND_LABELS} />
      </DenseSelectField>
      <DenseTextField
        label="Location"
        accessibleLabel={labelInRow('Location', row)}
        error={rowErrors?.location?.message}
        className="col-span-2 xl:col-span-5"
        control={control}
        name={`${rowPath}.location`}
      />
      <DenseTextField
        label="Model"
        accessibleLabel={labelInRow('Model', row)}
        error={rowErrors?.model?.message}
        className="col-span-2 xl:col-span-4"
        control={control}
        name={`${rowPath}.model`}
      />
      <AreaField
        rowPath={rowPath}
        row={row}
        areas={areas}
        error={rowErrors?.areaId?.message}
        className="col-span-2 xl:col-span-4"
      />
      <GradeAndCurrentFields rowPath={rowPath} row={row} errors={rowErrors} />
    </EditableRow>
  );
}
