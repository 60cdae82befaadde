import type { z } from 'zod';

import type { Device, DeviceInput, saveDevicesSchema } from '@server/devices/schema';

export type DeviceListFormValues = z.input<typeof saveDevicesSchema>;
export type DeviceArea = { id: string; number: number; name: string };

export function toDeviceFormRow(device: Device): DeviceInput {
  return {
    id: device.id,
    kind: device.kind,
    location: device.location,
    model: device.model,
    areaId: device.areaId,
    grade: device.grade,
    environmentalClass: device.environmentalClass,
    quiescentMa: device.quiescentMa,
    alarmMa: device.alarmMa,
  };
}

// Left empty on purpose: the select shows "Choose…" and the shared schema asks for a choice.
const unchosen = '' as never;

/** A new row; area, grade and class follow the row above, as they usually run the same. */
export function newDeviceRow(previous?: DeviceInput): DeviceInput {
  return {
    kind: unchosen,
    location: '',
    model: '',
    areaId: previous?.areaId ?? null,
    grade: previous?.grade ?? null,
    environmentalClass: previous?.environmentalClass ?? null,
    quiescentMa: null,
    alarmMa: null,
  };
}

export function duplicateDeviceRow(source: DeviceInput): DeviceInput {
  const { id: _id, ...settings } = structuredClone(source);
  return settings;
}

const shownDeviceField =
  /^devices\.\d+\.(kind|location|model|areaId|grade|environmentalClass|quiescentMa|alarmMa)$/;

/** Field paths the editor shows beside a field; any other API message goes in the summary. */
export function isDeviceFieldShown(fieldPath: string): boolean {
  return shownDeviceField.test(fieldPath);
}

/** What a device row's ids start with: "device-<key>-heading" (see `editableRowIds`). */
export const DEVICE_ROW_KIND = 'device';
