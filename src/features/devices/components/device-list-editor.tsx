import { useState, type ReactNode } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { FormProvider, useFieldArray, useForm } from 'react-hook-form';
import type { z } from 'zod';

import { EditableRowList } from '@/components/forms/editable-row';
import { ListSaveBar } from '@/components/forms/list-save-bar';
import { useRowListFocus } from '@/components/forms/use-row-list-focus';
import { FormProblem } from '@/components/ui/form-problem';
import { LiveMessage } from '@/components/ui/live-message';
import { useDevices } from '@/features/devices/api/get-devices';
import {
  saveDevicesSchema,
  useSaveDevices,
  type DeviceList,
} from '@/features/devices/api/save-devices';
import { DeviceRow } from '@/features/devices/components/device-row';
import {
  DEVICE_ROW_KIND,
  duplicateDeviceRow,
  isDeviceFieldShown,
  newDeviceRow,
  toDeviceFormRow,
  type DeviceArea,
  type DeviceListFormValues,
} from '@/features/devices/utils/device-form-values';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';
import { useReloadLatest } from '@/lib/use-reload-latest';
import { useShowNewerSavedVersion } from '@/lib/use-show-newer-saved-version';
import { useUnsavedChangesGuard } from '@/lib/use-unsaved-changes-guard';

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
  const { moveRow, removeRow } = useRowListFocus({
    fields,
    move,
    remove,
    rowKind: DEVICE_ROW_KIND,
    addButtonId: ADD_DEVICE_ID,
  });
  const [announcement, setAnnouncement] = useState('');
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const { isDirty } = formState;

  useShowNewerSavedVersion({
    form,
    versionField: 'devicesVersion',
    saved: list,
    savedVersion: devicesVersion,
    toFormValues,
  });

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
    if (!moveRow(index, to)) return;
    setAnnouncement(
      `Device ${index + 1} moved ${to < index ? 'up' : 'down'}; it is now device ${to + 1}.`,
    );
  };

  const removeDevice = (index: number) => {
    removeRow(index);
    setAnnouncement(`Device ${index + 1} removed. Save the devices to make it final.`);
  };

  const { isReloading, reloadLatest } = useReloadLatest(async () => {
    const latest = await onReloadLatest();
    if (latest && latest.devicesVersion !== null) {
      form.reset(toFormValues(latest, latest.devicesVersion));
      saveDevices.reset();
      setAnnouncement('Showing the latest saved devices.');
    }
  });

  useUnsavedChangesGuard(isDirty && !saveDevices.isPending);

  const deviceErrors = formState.errors.devices;

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={submit} className="grid gap-4">
        <FormProblem
          key={formState.submitCount}
          subject="The device list"
          fieldErrorCount={countFieldErrors(formState.errors)}
          error={saveDevices.error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={reloadLatest}
          isReloading={isReloading}
        />
        <EditableRowList
          label="Devices"
          rowCount={fields.length}
          emptyMessage="No devices yet. Add the keypads, sounders, expanders and communicators fitted."
          error={deviceErrors?.message ?? deviceErrors?.root?.message}
        >
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
        </EditableRowList>
        <ListSaveBar
          addButtonId={ADD_DEVICE_ID}
          addLabel="Add device"
          onAdd={addDevice}
          saveLabel="Save devices"
          isSaving={saveDevices.isPending}
          hasUnsavedChanges={isDirty}
          isSaved={!isDirty && saveDevices.isSuccess}
          onDiscard={() => {
            form.reset();
            setAnnouncement('Changes discarded: showing the saved devices.');
          }}
          rowCount={fields.length}
          rowNoun={['device', 'devices']}
        />
        <LiveMessage message={announcement} />
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
