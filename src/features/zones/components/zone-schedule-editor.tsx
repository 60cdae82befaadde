import { useEffect, useState, type ReactNode } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { CircleCheck, CircleDot, Plus, RotateCcw, Save } from 'lucide-react';
import { FormProvider, useFieldArray, useForm } from 'react-hook-form';
import type { z } from 'zod';

import type { ZoneSchedule } from '@server/zones/schema';
import { Button } from '@/components/ui/button';
import { FieldErrorMessage } from '@/components/ui/form-field';
import { FormProblem } from '@/components/ui/form-problem';
import { rowActionIds } from '@/components/ui/row-action-ids';
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
import { zoneRowHeadingId, zoneRowSentenceName } from '@/features/zones/utils/zone-row-names';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';
import { useUnsavedChangesGuard } from '@/lib/use-unsaved-changes-guard';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';

const ADD_ZONE_ID = 'add-zone';

const zoneCount = (count: number) => `${count} ${count === 1 ? 'zone' : 'zones'}`;

type ZoneScheduleFormProps = {
  siteId: string;
  schedule: ZoneSchedule;
  zonesVersion: number;
  onReloadLatest: () => Promise<ZoneSchedule | undefined>;
};

function ZoneScheduleForm({
  siteId,
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
  const focusAfterRender = useFocusAfterRender();
  const [announcement, setAnnouncement] = useState('');
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const [isReloading, setIsReloading] = useState(false);
  const { isDirty } = formState;

  // Someone else's save reached the cache (another tab, a refetch): show it, unless this form
  // holds typing that would be lost.
  useEffect(() => {
    if (!isDirty && getValues('zonesVersion') !== zonesVersion) {
      form.reset(toScheduleFormValues(schedule, zonesVersion));
    }
  }, [form, getValues, isDirty, schedule, zonesVersion]);

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

  const moveZone = (index: number, to: number) => {
    const field = fields[index];
    if (!field) return;
    const name = zoneRowSentenceName(getValues(`zones.${index}.number`), index + 1);
    move(index, to);
    const ids = rowActionIds(`zone-${field.id}`);
    // Keep focus on the button pressed; at the top or bottom it is disabled, so use the other.
    focusAfterRender(...(to < index ? [ids.up, ids.down] : [ids.down, ids.up]));
    setAnnouncement(`${name} moved ${to < index ? 'up' : 'down'} to row ${to + 1}.`);
  };

  const removeZone = (index: number) => {
    const name = zoneRowSentenceName(getValues(`zones.${index}.number`), index + 1);
    const neighbour = fields[index + 1] ?? fields[index - 1];
    remove(index);
    focusAfterRender(neighbour ? zoneRowHeadingId(neighbour.id) : ADD_ZONE_ID);
    setAnnouncement(`${name} removed. Save the schedule to make it final.`);
  };

  const reloadLatest = async () => {
    setIsReloading(true);
    try {
      const latest = await onReloadLatest();
      if (latest && latest.zonesVersion !== null) {
        form.reset(toScheduleFormValues(latest, latest.zonesVersion));
        saveZones.reset();
        setAnnouncement('Showing the latest saved schedule.');
      }
    } finally {
      setIsReloading(false);
    }
  };

  useUnsavedChangesGuard(isDirty && !saveZones.isPending);

  const zoneErrors = formState.errors.zones;
  const isSaved = !isDirty && saveZones.isSuccess;

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={submit} className="grid gap-4">
        <FormProblem
          key={formState.submitCount}
          subject="The zone schedule"
          fieldErrorCount={countFieldErrors(formState.errors)}
          error={saveZones.error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={() => void reloadLatest()}
          isReloading={isReloading}
        />

        {fields.length === 0 ? (
          <p className="rounded-lg border border-dashed border-hairline bg-white px-4 py-6 text-center text-ink-muted">
            No zones yet. Add the first zone, then save the schedule.
          </p>
        ) : (
          <ol aria-label="Zone schedule" className="grid gap-3">
            {fields.map((field, index) => (
              <ZoneRow
                key={field.id}
                index={index}
                rowCount={fields.length}
                rowKey={field.id}
                areas={schedule.areas}
                onMoveUp={() => moveZone(index, index - 1)}
                onMoveDown={() => moveZone(index, index + 1)}
                onDuplicate={() => duplicateZone(index)}
                onRemove={() => removeZone(index)}
              />
            ))}
          </ol>
        )}
        <FieldErrorMessage message={zoneErrors?.message ?? zoneErrors?.root?.message} />

        <div className="flex flex-wrap items-center gap-3 rounded-lg border border-hairline bg-white px-4 py-3">
          <Button id={ADD_ZONE_ID} variant="secondary" onClick={addZone}>
            <Plus aria-hidden="true" className="size-4" />
            Add zone
          </Button>
          <Button type="submit" disabled={saveZones.isPending}>
            <Save aria-hidden="true" className="size-4" />
            {saveZones.isPending ? 'Saving…' : 'Save schedule'}
          </Button>
          <Button
            variant="secondary"
            disabled={!isDirty || saveZones.isPending}
            onClick={() => {
              form.reset();
              setAnnouncement('Changes discarded: showing the saved schedule.');
            }}
          >
            <RotateCcw aria-hidden="true" className="size-4" />
            Discard changes
          </Button>
          <p className="ml-auto flex items-center gap-1.5 text-sm">
            <span className="font-mono font-semibold">{fields.length}</span>
            {fields.length === 1 ? 'zone' : 'zones'}
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

type ZoneScheduleEditorProps = {
  siteId: string;
  /** Shown instead of the editor until the system is recorded. */
  noSystemNotice: ReactNode;
};

/**
 * The as-fitted zone schedule, edited as a whole and saved in one go with its version, so two
 * people editing at once cannot silently overwrite each other.
 */
export function ZoneScheduleEditor({ siteId, noSystemNotice }: ZoneScheduleEditorProps) {
  const zones = useZones(siteId);
  const { zonesVersion } = zones.data;
  if (zonesVersion === null) return <>{noSystemNotice}</>;
  return (
    <ZoneScheduleForm
      siteId={siteId}
      schedule={zones.data}
      zonesVersion={zonesVersion}
      onReloadLatest={async () => (await zones.refetch()).data}
    />
  );
}
