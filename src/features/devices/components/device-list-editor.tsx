import { useEffect, useState, type ReactNode } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { CircleCheck, CircleDot, Plus, RotateCcw, Save } from 'lucide-react';
import { FormProvider, useFieldArray, useForm } from 'react-hook-form';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { FieldErrorMessage } from '@/components/ui/form-field';
import { FormProblem } from '@/components/ui/form-problem';
import { rowActionIds } from '@/components/ui/row-action-ids';
import { useDevices } from '@/features/devices/api/get-devices';
import {
  saveDevicesSchema,
  useSaveDevices,
  type DeviceList,
} from '@/features/devices/api/save-devices';
import { DeviceRow } from '@/features/devices/components/device-row';
import {
  deviceRowHeadingId,
  duplicateDeviceRow,
  isDeviceFieldShown,
  newDeviceRow,
  toDeviceFormRow,
  type DeviceArea,
  type DeviceListFormValues,
} from '@/features/devices/utils/device-form-values';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';
import { useUnsavedChangesGuard } from '@/lib/use-unsaved-changes-guard';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';

const ADD_DEVICE_ID = 'add-device';

const deviceCount = (count: number) => `${count} ${count === 1 ? 'device' : 'devices'}`;

function toFormValues(list: DeviceList, devicesVersion: number): DeviceListFormValues {
  return { devicesVersion, devices: list.devices.map(toDeviceFormRow) };
}

type DeviceListFormProps = {
  siteId: string;
  list: DeviceList;
  devicesVersion: number;
  areas: readonly DeviceArea[];
  onReloadLatest: () => Promise<DeviceList | undefined>;
};

function DeviceListForm({
  siteId,
  list,
  devicesVersion,
  areas,
  onReloadLatest,
}: DeviceListFormProps) {
  const form = useForm<DeviceListFormValues, unknown, z.output<typeof saveDevicesSchema>>({
    resolver: zodResolver(saveDevicesSchema),
    defaultValues: toFormValues(list, devicesVersion),
  });
  const { control, getValues, formState } = form;
  const { fields, append, insert, move, remove } = useFieldArray({ control, name: 'devices' });
  const focusAfterRender = useFocusAfterRender();
  const [announcement, setAnnouncement] = useState('');
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const [isReloading, setIsReloading] = useState(false);
  const { isDirty } = formState;

  // A newer list reached the cache: show it, unless this form holds unsaved typing.
  useEffect(() => {
    if (!isDirty && getValues('devicesVersion') !== devicesVersion) {
      form.reset(toFormValues(list, devicesVersion));
    }
  }, [form, getValues, isDirty, list, devicesVersion]);

  const saveDevices = useSaveDevices({
    onSuccess: (saved) => {
      if (saved.devicesVersion !== null) form.reset(toFormValues(saved, saved.devicesVersion));
      setAnnouncement(`Devices saved: ${deviceCount(saved.devices.length)}.`);
    },
    onError: (error) =>
      setUnplacedMessages(applyServerFieldErrors(error, form.setError, isDeviceFieldShown)),
  });

  const submit = form.handleSubmit((values) => {
    setUnplacedMessages([]);
    setAnnouncement('');
    saveDevices.mutate({ siteId, values });
  });

  const addDevice = () => {
    const rows = getValues('devices');
    append(newDeviceRow(rows.at(-1)), { focusName: `devices.${rows.length}.kind` });
    setAnnouncement(`Device ${rows.length + 1} added.`);
  };

  const duplicateDevice = (index: number) => {
    insert(index + 1, duplicateDeviceRow(getValues(`devices.${index}`)), {
      focusName: `devices.${index + 1}.location`,
    });
    setAnnouncement(`Device ${index + 1} duplicated as device ${index + 2}.`);
  };

  const moveDevice = (index: number, to: number) => {
    const field = fields[index];
    if (!field) return;
    move(index, to);
    const ids = rowActionIds(`device-${field.id}`);
    focusAfterRender(...(to < index ? [ids.up, ids.down] : [ids.down, ids.up]));
    setAnnouncement(
      `Device ${index + 1} moved ${to < index ? 'up' : 'down'}; it is now device ${to + 1}.`,
    );
  };

  const removeDevice = (index: number) => {
    const neighbour = fields[index + 1] ?? fields[index - 1];
    remove(index);
    focusAfterRender(neighbour ? deviceRowHeadingId(neighbour.id) : ADD_DEVICE_ID);
    setAnnouncement(`Device ${index + 1} removed. Save the devices to make it final.`);
  };

  const reloadLatest = async () => {
    setIsReloading(true);
    try {
      const latest = await onReloadLatest();
      if (latest && latest.devicesVersion !== null) {
        form.reset(toFormValues(latest, latest.devicesVersion));
        saveDevices.reset();
        setAnnouncement('Showing the latest saved devices.');
      }
    } finally {
      setIsReloading(false);
    }
  };

  useUnsavedChangesGuard(isDirty && !saveDevices.isPending);

  const deviceErrors = formState.errors.devices;
  const isSaved = !isDirty && saveDevices.isSuccess;

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={submit} className="grid gap-4">
        <FormProblem
          key={formState.submitCount}
          subject="The device list"
          fieldErrorCount={countFieldErrors(formState.errors)}
          error={saveDevices.error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={() => void reloadLatest()}
          isReloading={isReloading}
        />
        {fields.length === 0 ? (
          <p className="rounded-lg border border-dashed border-hairline bg-white px-4 py-6 text-center text-ink-muted">
            No devices yet. Add the keypads, sounders, expanders and communicators fitted.
          </p>
        ) : (
          <ol aria-label="Devices" className="grid gap-3">
            {fields.map((field, index) => (
              <DeviceRow
                key={field.id}
                index={index}
                rowCount={fields.length}
                rowKey={field.id}
                areas={areas}
                onMoveUp={() => moveDevice(index, index - 1)}
                onMoveDown={() => moveDevice(index, index + 1)}
                onDuplicate={() => duplicateDevice(index)}
                onRemove={() => removeDevice(index)}
              />
            ))}
          </ol>
        )}
        <FieldErrorMessage message={deviceErrors?.message ?? deviceErrors?.root?.message} />

        <div className="flex flex-wrap items-center gap-3 rounded-lg border border-hairline bg-white px-4 py-3">
          <Button id={ADD_DEVICE_ID} variant="secondary" onClick={addDevice}>
            <Plus aria-hidden="true" className="size-4" />
            Add device
          </Button>
          <Button type="submit" disabled={saveDevices.isPending}>
            <Save aria-hidden="true" className="size-4" />
            {saveDevices.isPending ? 'Saving…' : 'Save devices'}
          </Button>
          <Button
            variant="secondary"
            disabled={!isDirty || saveDevices.isPending}
            onClick={() => {
              form.reset();
              setAnnouncement('Changes discarded: showing the saved devices.');
            }}
          >
            <RotateCcw aria-hidden="true" className="size-4" />
            Discard changes
          </Button>
          <p className="ml-auto flex items-center gap-1.5 text-sm">
            <span className="font-mono font-semibold">{fields.length}</span>
            {fields.length === 1 ? 'device' : 'devices'}
            {isDirty ? (
              <span className="ml-2 inline-flex items-center gap-1 font-medium text-fault-text">
                <CircleDot aria-hidden="true" className="size-4" />
                Unsaved changes
              </span>
            ) : isSaved ? (
              <span className="ml-2 inline-flex items-center gap-1 font-medium text-normal">
                <CircleCheck aria-hidden="true" className="size-4" />
                Saved
              </span>
            ) : null}
          </p>
        </div>
        <p role="status" className="sr-only">
          {announcement}
        </p>
      </form>
    </FormProvider>
  );
}

type DeviceListEditorProps = {
  siteId: string;
  /** The system's areas, which a device may be placed in. */
  areas: readonly DeviceArea[];
  /** Shown instead of the editor until the system is recorded. */
  noSystemNotice: ReactNode;
};

export function DeviceListEditor({ siteId, areas, noSystemNotice }: DeviceListEditorProps) {
  const devices = useDevices(siteId);
  const { devicesVersion } = devices.data;
  if (devicesVersion === null) return <>{noSystemNotice}</>;
  return (
    <DeviceListForm
      siteId={siteId}
      list={devices.data}
      devicesVersion={devicesVersion}
      areas={areas}
      onReloadLatest={async () => (await devices.refetch()).data}
    />
  );
}
