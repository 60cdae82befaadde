import { useState, type ReactNode } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { FormProvider, useFieldArray, useForm } from 'react-hook-form';
import type { z } from 'zod';

import type { ZoneSchedule } from '@server/zones/schema';
import { EditableRowList } from '@/components/forms/editable-row';
import { ListSaveBar } from '@/components/forms/list-save-bar';
import { useRowListFocus } from '@/components/forms/use-row-list-focus';
import { FormProblem } from '@/components/ui/form-problem';
import { LiveMessage } from '@/components/ui/live-message';
import { saveZonesSchema, useSaveZones } from '@/features/zones/api/save-zones';
import { useZones } from '@/features/zones/api/get-zones';
import { ZoneRow } from '@/features/zones/components/zone-row';
import {
  duplicateZoneRow,
  isZoneFieldShown,
  newZoneRow,
  toScheduleFormValues,
  type ZoneScheduleFormValues,
} from '@/features/zones/utils/zone-form-values';
import { nextFreeZoneNumber } from '@/features/zones/utils/zone-numbers';
import { ZONE_ROW_KIND, zoneRowSentenceName } from '@/features/zones/utils/zone-row-names';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';
import type { LoopSettings } from '@/lib/loop-readings';
import { useReloadLatest } from '@/lib/use-reload-latest';
import { useShowNewerSavedVersion } from '@/lib/use-show-newer-saved-version';
import { useUnsavedChangesGuard } from '@/lib/use-unsaved-changes-guard';

const ADD_ZONE_ID = 'add-zone';

const zoneCount = (count: number) => `${count} ${count === 1 ? 'zone' : 'zones'}`;

type ZoneScheduleFormProps = {
  siteId: string;
  loopSettings: LoopSettings;
  schedule: ZoneSchedule;
  zonesVersion: number;
  onReloadLatest: () => Promise<ZoneSchedule | undefined>;
};

function ZoneScheduleForm({
  siteId,
  loopSettings,
  schedule,
  zonesVersion,
  onReloadLatest,
}: ZoneScheduleFormProps) {
  const form = useForm<ZoneScheduleFormValues, unknown, z.output<typeof saveZonesSchema>>({
    resolver: zodResolver(saveZonesSchema),
    defaultValues: toScheduleFormValues(schedule, zonesVersion),
  });
  const { control, getValues, formState } = form;
  const { fields, append, insert, move, remove } = useFieldArray({ control, name: 'zones' });
  const { moveRow, removeRow } = useRowListFocus({
    fields,
    move,
    remove,
    rowKind: ZONE_ROW_KIND,
    addButtonId: ADD_ZONE_ID,
  });
  const [announcement, setAnnouncement] = useState('');
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const { isDirty } = formState;

  useShowNewerSavedVersion({
    form,
    versionField: 'zonesVersion',
    saved: schedule,
    savedVersion: zonesVersion,
    toFormValues: toScheduleFormValues,
  });

  const saveZones = useSaveZones({
    onSuccess: (saved) => {
      if (saved.zonesVersion !== null) form.reset(toScheduleFormValues(saved, saved.zonesVersion));
      setAnnouncement(`Schedule saved: ${zoneCount(saved.zones.length)}.`);
    },
    onError: (error) =>
      setUnplacedMessages(applyServerFieldErrors(error, form.setError, isZoneFieldShown)),
  });

  const submit = form.handleSubmit((values) => {
    setUnplacedMessages([]);
    setAnnouncement('');
    saveZones.mutate({ siteId, values });
  });

  const zoneNumbers = () => getValues('zones').map((zone) => zone.number);

  const addZone = () => {
    const rows = getValues('zones');
    const previous = rows.at(-1);
    const lastNumber = typeof previous?.number === 'number' ? previous.number : 0;
    const number = nextFreeZoneNumber(zoneNumbers(), lastNumber);
    append(newZoneRow(number, previous), { focusName: `zones.${rows.length}.location` });
    setAnnouncement(`Zone ${number} added in row ${rows.length + 1}.`);
  };

  const duplicateZone = (index: number) => {
    const source = getValues(`zones.${index}`);
    const after = typeof source.number === 'number' ? source.number : 0;
    const number = nextFreeZoneNumber(zoneNumbers(), after);
    insert(index + 1, duplicateZoneRow(source, number), {
      focusName: `zones.${index + 1}.location`,
    });
    setAnnouncement(
      `${zoneRowSentenceName(source.number, index + 1)} duplicated as zone ${number} in row ${index + 2}.`,
    );
  };

  // Named before the rows change, while the index still points at the zone meant.
  const rowName = (index: number) =>
    zoneRowSentenceName(getValues(`zones.${index}.number`), index + 1);

  const moveZone = (index: number, to: number) => {
    const name = rowName(index);
    if (!moveRow(index, to)) return;
    setAnnouncement(`${name} moved ${to < index ? 'up' : 'down'} to row ${to + 1}.`);
  };

  const removeZone = (index: number) => {
    const name = rowName(index);
    removeRow(index);
    setAnnouncement(`${name} removed. Save the schedule to make it final.`);
  };

  const { isReloading, reloadLatest } = useReloadLatest(async () => {
    const latest = await onReloadLatest();
    if (latest && latest.zonesVersion !== null) {
      form.reset(toScheduleFormValues(latest, latest.zonesVersion));
      saveZones.reset();
      setAnnouncement('Showing the latest saved schedule.');
    }
  });

  useUnsavedChangesGuard(isDirty && !saveZones.isPending);

  const zoneErrors = formState.errors.zones;

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={submit} className="grid gap-4">
        <FormProblem
          key={formState.submitCount}
          subject="The zone schedule"
          fieldErrorCount={countFieldErrors(formState.errors)}
          error={saveZones.error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={reloadLatest}
          isReloading={isReloading}
        />

        <EditableRowList
          label="Zone schedule"
          rowCount={fields.length}
          emptyMessage="No zones yet. Add the first zone, then save the schedule."
          error={zoneErrors?.message ?? zoneErrors?.root?.message}
        >
          {fields.map((field, index) => (
            <ZoneRow
              key={field.id}
              index={index}
              rowCount={fields.length}
              rowKey={field.id}
              areas={schedule.areas}
              loopSettings={loopSettings}
              onMoveUp={() => moveZone(index, index - 1)}
              onMoveDown={() => moveZone(index, index + 1)}
              onDuplicate={() => duplicateZone(index)}
              onRemove={() => removeZone(index)}
            />
          ))}
        </EditableRowList>

        <ListSaveBar
          addButtonId={ADD_ZONE_ID}
          addLabel="Add zone"
          onAdd={addZone}
          saveLabel="Save schedule"
          isSaving={saveZones.isPending}
          hasUnsavedChanges={isDirty}
          isSaved={!isDirty && saveZones.isSuccess}
          onDiscard={() => {
            form.reset();
            setAnnouncement('Changes discarded: showing the saved schedule.');
          }}
          rowCount={fields.length}
          rowNoun={['zone', 'zones']}
        />
        <LiveMessage message={announcement} />
      </form>
    </FormProvider>
  );
}

type ZoneScheduleEditorProps = {
  siteId: string;
  /** The system's resistor tolerance and cable core, for each zone's expected readings. */
  loopSettings: LoopSettings;
  /** Shown instead of the editor until the system is recorded. */
  noSystemNotice: ReactNode;
};

/**
 * The as-fitted zone schedule, edited as a whole and saved in one go with its version, so two
 * people editing at once cannot silently overwrite each other.
 */
export function ZoneScheduleEditor({
  siteId,
  loopSettings,
  noSystemNotice,
}: ZoneScheduleEditorProps) {
  const zones = useZones(siteId);
  const { zonesVersion } = zones.data;
  if (zonesVersion === null) return <>{noSystemNotice}</>;
  return (
    <ZoneScheduleForm
      siteId={siteId}
      loopSettings={loopSettings}
      schedule={zones.data}
      zonesVersion={zonesVersion}
      onReloadLatest={async () => (await zones.refetch()).data}
    />
  );
}
