import { z } from 'zod';
import {
  fittedComponentFields,
  fittedComponentRecordFields,
  idSchema,
  trimmed,
  versionSchema,
} from '../schema/fields';

export const DEVICE_KINDS = [
  'keypad',
  'internal_sounder',
  'external_sounder',
  'expander',
  'communicator',
  'power_supply',
  'other',
] as const;
export type DeviceKind = (typeof DEVICE_KINDS)[number];

export const DEVICE_KIND_LABELS: Record<DeviceKind, string> = {
  keypad: 'Keypad',
  internal_sounder: 'Internal sounder',
  external_sounder: 'External sounder',
  expander: 'Zone expander',
  communicator: 'Communicator',
  power_supply: 'Remote power supply',
  other: 'Other',
};

export const deviceInputSchema = z
  .object({
    id: idSchema.optional(),
    kind: z.enum(DEVICE_KINDS, { error: 'Choose the kind of device.' }),
    location: trimmed(120, 'Location').min(1, 'Say where the device is, e.g. Hall by front door.'),
    model: trimmed(120, 'Model').default(''),
    ...fittedComponentFields,
  })
  .strict();
export type DeviceInput = z.input<typeof deviceInputSchema>;

export const saveDevicesSchema = z
  .object({
    devicesVersion: versionSchema,
    devices: z.array(deviceInputSchema).max(128, 'At most 128 devices.'),
  })
  .strict();
export type SaveDevicesInput = z.input<typeof saveDevicesSchema>;

export const deviceSchema = z.object({
  id: z.string(),
  position: z.number(),
  kind: z.enum(DEVICE_KINDS),
  location: z.string(),
  model: z.string(),
  ...fittedComponentRecordFields,
});
export type Device = z.infer<typeof deviceSchema>;

export const deviceListSchema = z.object({
  devicesVersion: z.number().nullable(),
  devices: z.array(deviceSchema),
});
