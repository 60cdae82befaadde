import { useState } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { Cable, Cpu, Layers, Plus, Radio, Trash2, Zap } from 'lucide-react';
import {
  FormProvider,
  useFieldArray,
  useForm,
  useFormContext,
  useWatch,
  type UseFormRegisterReturn,
} from 'react-hook-form';
import type { z } from 'zod';

import { DEFAULT_SOUNDER_MINUTES, MAX_SOUNDER_MINUTES } from '@server/calc/power';
import { GRADES } from '@server/schema/fields';
import {
  BEARERS,
  CABLE_CORES,
  NOTIFICATION_OPTIONS,
  PSU_TYPES,
  RESISTOR_TOLERANCES,
  saveSystemSchema,
  type SystemRecord,
} from '@server/systems/schema';
import {
  DenseNumberField,
  DenseSelectField,
  DenseTextField,
} from '@/components/forms/dense-fields';
import { labelInRow } from '@/components/forms/row-label';
import { SaveRow } from '@/components/forms/save-row';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FieldErrorMessage, FormField } from '@/components/ui/form-field';
import { FormProblem } from '@/components/ui/form-problem';
import { checkboxClassName, inputClassName, selectClassName } from '@/components/ui/form-styles';
import { rowActionIds } from '@/components/ui/row-action-ids';
import { RowActions } from '@/components/ui/row-actions';
import { useSystem } from '@/features/systems/api/get-system';
import { useSaveSystem } from '@/features/systems/api/save-system';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';
import { numberOrNull, numberOrUndefined, textOrNull } from '@/lib/form-values';
import { lowestFreeNumber } from '@/lib/lowest-free-number';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';
import { useReloadLatest } from '@/lib/use-reload-latest';
import { useShowNewerSavedVersion } from '@/lib/use-show-newer-saved-version';
import { useUnsavedChangesGuard } from '@/lib/use-unsaved-changes-guard';

type SystemFormValues = z.input<typeof saveSystemSchema>;
type SystemFormOutput = z.output<typeof saveSystemSchema>;

const BEARER_LABELS: Record<(typeof BEARERS)[number], string> = {
  ip: 'IP (network)',
  cellular: 'Cellular',
  pstn: 'Telephone line (PSTN)',
  radio: 'Radio',
};

const MAX_SIGNALLING_PATHS = 4;

function toFormValues(system: SystemRecord | null): SystemFormValues {
  if (!system) {
    return {
      controlPanel: '',
      firmware: '',
      panelLocation: '',
      psuType: null,
      batteryAh: null,
      notification: null,
      mainsFailureSignalled: false,
      panelGrade: null,
      panelQuiescentMa: null,
      panelAlarmMa: null,
      sounderMinutes: DEFAULT_SOUNDER_MINUTES,
      standbyHoursOverride: null,
      resistorTolerance: 0.05,
      cableCore: '7/0.2',
      supplyVolts: 13.7,
      signallingPaths: [],
      areas: [],
      version: null,
    };
  }
  return {
    controlPanel: system.controlPanel,
    firmware: system.firmware,
    panelLocation: system.panelLocation,
    psuType: system.psuType,
    batteryAh: system.batteryAh,
    notification: system.notification,
    mainsFailureSignalled: system.mainsFailureSignalled,
    panelGrade: system.panelGrade,
    panelQuiescentMa: system.panelQuiescentMa,
    panelAlarmMa: system.panelAlarmMa,
    sounderMinutes: system.sounderMinutes,
    standbyHoursOverride: system.standbyHoursOverride,
    resistorTolerance: system.resistorTolerance as SystemFormValues['resistorTolerance'],
    cableCore: system.cableCore,
    supplyVolts: system.supplyVolts,
    signallingPaths: system.signallingPaths.map((path) => ({
      bearer: path.bearer,
      atsCategory: path.atsCategory,
      description: path.description,
      toMonitoringCentre: path.toMonitoringCentre,
    })),
    areas: system.areas.map((area) => ({ id: area.id, number: area.number, name: area.name })),
    version: system.version,
  };
}

function isShownField(fieldPath: string) {
  return fieldPath !== 'version' && fieldPath !== 'signallingPaths' && fieldPath !== 'areas';
}

function SignallingPaths() {
  const {
    control,
    register,
    formState: { errors },
  } = useFormContext<SystemFormValues>();
  const { fields, append, remove, move } = useFieldArray({ control, name: 'signallingPaths' });
  const focusAfterRender = useFocusAfterRender();
  const [announcement, setAnnouncement] = useState('');
  const pathErrors = errors.signallingPaths;

  return (
    <div className="grid gap-3">
      <div>
        <h4 className="font-semibold">Signalling paths</h4>
        <p className="text-sm text-ink-muted">
          In order of use: the primary path first. The ATS category is as marked on the equipment
          (EN 50136-1), e.g. SP2 or DP3.
        </p>
      </div>
      {fields.length === 0 ? (
        <p className="text-sm">No signalling path recorded: an audible-only system.</p>
      ) : (
        <ol className="grid gap-3">
          {fields.map((field, index) => {
            const row = index + 1;
            const rowErrors = pathErrors?.[index];
            const idPrefix = `path-${field.id}`;
            return (
              <li
                key={field.id}
                className="grid gap-3 rounded-md border border-hairline bg-paper/50 p-3"
              >
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <p className="text-sm font-semibold">
                    {row === 1 ? 'Path 1 (primary)' : `Path ${row}`}
                  </p>
                  <RowActions
                    itemName={`path ${row}`}
                    idPrefix={idPrefix}
                    isFirst={index === 0}
                    isLast={index === fields.length - 1}
                    onMoveUp={() => {
                      move(index, index - 1);
                      focusAfterRender(rowActionIds(idPrefix).up, rowActionIds(idPrefix).down);
                      setAnnouncement(`Path ${row} moved up to position ${row - 1}.`);
                    }}
                    onMoveDown={() => {
                      move(index, index + 1);
                      focusAfterRender(rowActionIds(idPrefix).down, rowActionIds(idPrefix).up);
                      setAnnouncement(`Path ${row} moved down to position ${row + 1}.`);
                    }}
                    onRemove={() => {
                      remove(index);
                      focusAfterRender('add-signalling-path');
                      setAnnouncement(`Path ${row} removed.`);
                    }}
                  />
                </div>
                <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-[12rem_8rem_minmax(0,1fr)_auto]">
                  <DenseSelectField
                    label="Bearer"
                    accessibleLabel={`Bearer, path ${row}`}
                    error={rowErrors?.bearer?.message}
                    control={control}
                    name={`signallingPaths.${index}.bearer`}
                  >
                    {BEARERS.map((bearer) => (
                      <option key={bearer} value={bearer}>
                        {BEARER_LABELS[bearer]}
                      </option>
                    ))}
                  </DenseSelectField>
                  <DenseTextField
                    label="ATS category"
                    accessibleLabel={`ATS category, path ${row}`}
                    error={rowErrors?.atsCategory?.message}
                    control={control}
                    name={`signallingPaths.${index}.atsCategory`}
                    code
                    controlClassName="uppercase"
                  />
                  <DenseTextField
                    label="Description"
                    accessibleLabel={`Description, path ${row}`}
                    error={rowErrors?.description?.message}
                    control={control}
                    name={`signallingPaths.${index}.description`}
                  />
                  <label className="flex min-h-9 items-center gap-2 self-end text-sm">
                    <input
                      type="checkbox"
                      {...register(`signallingPaths.${index}.toMonitoringCentre`)}
                      aria-label={`To the monitoring centre, path ${row}`}
                      className={checkboxClassName}
                    />
                    <span aria-hidden="true">To the monitoring centre</span>
                  </label>
                </div>
              </li>
            );
          })}
        </ol>
      )}
      <FieldErrorMessage message={pathErrors?.message ?? pathErrors?.root?.message} />
      <div>
        <Button
          id="add-signalling-path"
          variant="secondary"
          disabled={fields.length >= MAX_SIGNALLING_PATHS}
          onClick={() => {
            append(
              { bearer: 'ip', atsCategory: '', description: '', toMonitoringCentre: true },
              { focusName: `signallingPaths.${fields.length}.bearer` },
            );
            setAnnouncement(`Path ${fields.length + 1} added.`);
          }}
        >
          <Plus aria-hidden="true" className="size-4" />
          Add signalling path
        </Button>
        {fields.length >= MAX_SIGNALLING_PATHS ? (
          <p className="mt-1 text-sm text-ink-muted">At most four signalling paths.</p>
        ) : null}
      </div>
      <p role="status" className="sr-only">
        {announcement}
      </p>
    </div>
  );
}

function Areas() {
  const {
    control,
    getValues,
    formState: { errors },
  } = useFormContext<SystemFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'areas' });
  const focusAfterRender = useFocusAfterRender();
  const [announcement, setAnnouncement] = useState('');
  const areaErrors = errors.areas;

  return (
    <div className="grid gap-3">
      <p className="text-sm text-ink-muted">
        The parts of the system that can be set and unset on their own. Zones and devices are placed
        in an area; removing an area leaves its zones and devices unassigned when you save.
      </p>
      {fields.length === 0 ? (
        <p className="text-sm">No areas recorded: the whole system sets and unsets together.</p>
      ) : (
        <ol className="grid gap-2">
          {fields.map((field, index) => {
            const row = index + 1;
            const rowErrors = areaErrors?.[index];
            return (
              <li
                key={field.id}
                className="grid grid-cols-[5rem_minmax(0,1fr)_auto] items-start gap-3"
              >
                <DenseNumberField
                  label="Number"
                  accessibleLabel={labelInRow('Area number', row)}
                  error={rowErrors?.number?.message}
                  control={control}
                  name={`areas.${index}.number`}
                  registerOptions={{ setValueAs: numberOrNull }}
                  min={1}
                  max={99}
                  inputMode="numeric"
                />
                <DenseTextField
                  label="Area name"
                  accessibleLabel={labelInRow('Area name', row)}
                  error={rowErrors?.name?.message}
                  control={control}
                  name={`areas.${index}.name`}
                />
                <Button
                  id={`area-${field.id}-remove`}
                  variant="secondary"
                  className="mt-4.5 min-w-9 px-2"
                  aria-label={`Remove area, row ${row}`}
                  title="Remove area"
                  onClick={() => {
                    remove(index);
                    const next = fields[index + 1] ?? fields[index - 1];
                    focusAfterRender(next ? `area-${next.id}-remove` : 'add-area', 'add-area');
                    setAnnouncement(`Area in row ${row} removed.`);
                  }}
                >
                  <Trash2 aria-hidden="true" className="size-4" />
                </Button>
              </li>
            );
          })}
        </ol>
      )}
      <FieldErrorMessage message={areaErrors?.message ?? areaErrors?.root?.message} />
      <div>
        <Button
          id="add-area"
          variant="secondary"
          onClick={() => {
            const number = lowestFreeNumber((getValues('areas') ?? []).map((area) => area.number));
            append({ number, name: '' }, { focusName: `areas.${fields.length}.name` });
            setAnnouncement(`Area ${number} added.`);
          }}
        >
          <Plus aria-hidden="true" className="size-4" />
          Add area
        </Button>
      </div>
      <p role="status" className="sr-only">
        {announcement}
      </p>
    </div>
  );
}

/** A measured quantity: a short numeric box in the reading font, with its label and hint. */
function NumberField({
  registration,
  inputMode = 'decimal',
  step = 'any',
  min,
  max,
  ...field
}: {
  label: string;
  hint?: string;
  optional?: boolean;
  error?: string;
  registration: UseFormRegisterReturn;
  inputMode?: 'decimal' | 'numeric';
  step?: string;
  min?: string | number;
  max?: string | number;
}) {
  return (
    <FormField {...field}>
      {(control) => (
        <input
          {...control}
          {...registration}
          type="number"
          step={step}
          min={min}
          max={max}
          inputMode={inputMode}
          className={inputClassName({ mono: true, className: 'max-w-32' })}
        />
      )}
    </FormField>
  );
}

export function SystemForm({ siteId }: { siteId: string }) {
  const system = useSystem(siteId);
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const [savedMessage, setSavedMessage] = useState('');
  const form = useForm<SystemFormValues, unknown, SystemFormOutput>({
    resolver: zodResolver(saveSystemSchema),
    defaultValues: toFormValues(system.data),
  });
  const {
    register,
    setValue,
    control,
    formState: { errors },
  } = form;
  const psuType = useWatch({ control, name: 'psuType' });
  const { isDirty } = form.formState;

  useShowNewerSavedVersion({
    form,
    versionField: 'version',
    saved: system.data,
    savedVersion: system.data?.version ?? null,
    toFormValues,
  });

  const saveSystem = useSaveSystem({
    onSuccess: (saved) => {
      form.reset(toFormValues(saved));
      setSavedMessage('System saved.');
    },
    onError: (error) =>
      setUnplacedMessages(applyServerFieldErrors(error, form.setError, isShownField)),
  });

  useUnsavedChangesGuard(isDirty && !saveSystem.isPending);

  const submit = form.handleSubmit((values) => {
    setUnplacedMessages([]);
    setSavedMessage('');
    saveSystem.mutate({ siteId, values });
  });

  const { isReloading, reloadLatest } = useReloadLatest(async () => {
    const latest = await system.refetch();
    if (latest.isSuccess) {
      form.reset(toFormValues(latest.data));
      saveSystem.reset();
      setSavedMessage('Showing the latest saved system.');
    }
  });

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={submit} className="grid gap-6">
        {system.data === null ? (
          <p className="text-sm text-ink-muted">
            Nothing is recorded yet. Saving this page records the system; the zone schedule and
            devices can be filled in after that.
          </p>
        ) : null}
        <FormProblem
          key={form.formState.submitCount}
          subject="The system"
          fieldErrorCount={countFieldErrors(errors)}
          error={saveSystem.error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={reloadLatest}
          isReloading={isReloading}
        />

        <Card title="Panel" icon={Cpu} headingLevel={3}>
          <div className="grid gap-4 md:grid-cols-2">
            <FormField
              label="Control panel"
              hint="Make and model, as written on the panel."
              error={errors.controlPanel?.message}
            >
              {(control) => (
                <input
                  {...control}
                  {...register('controlPanel')}
                  className={inputClassName()}
                  autoComplete="off"
                />
              )}
            </FormField>
            <FormField label="Firmware" optional error={errors.firmware?.message}>
              {(control) => (
                <input
                  {...control}
                  {...register('firmware')}
                  className={inputClassName({ mono: true })}
                  autoComplete="off"
                  spellCheck={false}
                />
              )}
            </FormField>
            <FormField
              label="Panel location"
              hint="Where to find it, e.g. Under-stairs cupboard."
              error={errors.panelLocation?.message}
            >
              {(control) => (
                <input
                  {...control}
                  {...register('panelLocation')}
                  className={inputClassName()}
                  autoComplete="off"
                />
              )}
            </FormField>
            <FormField
              label="Panel grade"
              hint="The EN 50131 grade on the panel's label. The system's grade is its lowest part's."
              error={errors.panelGrade?.message}
            >
              {(control) => (
                <select
                  {...control}
                  {...register('panelGrade', { setValueAs: numberOrNull })}
                  className={selectClassName({ className: 'max-w-56' })}
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
            <NumberField
              label="Panel quiescent current (mA)"
              hint="What the panel itself draws when all is quiet, from its data sheet."
              optional
              error={errors.panelQuiescentMa?.message}
              registration={register('panelQuiescentMa', { setValueAs: numberOrNull })}
              step="any"
              min="0"
              inputMode="decimal"
            />
            <NumberField
              label="Panel current in alarm (mA)"
              hint="What the panel draws in alarm, without the sounders listed as devices."
              optional
              error={errors.panelAlarmMa?.message}
              registration={register('panelAlarmMa', { setValueAs: numberOrNull })}
              step="any"
              min="0"
              inputMode="decimal"
            />
          </div>
        </Card>

        <Card title="Power supply" icon={Zap} headingLevel={3}>
          <div className="grid gap-4 md:grid-cols-2">
            <FormField
              label="Power supply type"
              hint="As classified in EN 50131-6. Type A recharges its own battery; type B's battery is not recharged by it."
              error={errors.psuType?.message}
            >
              {(control) => (
                <select
                  {...control}
                  {...register('psuType', {
                    setValueAs: textOrNull,
                    // A type C supply has no standby battery of its own to record.
                    onChange: (event: { target: { value: string } }) => {
                      if (event.target.value === 'C') setValue('batteryAh', null);
                    },
                  })}
                  className={selectClassName()}
                >
                  <option value="">Not recorded</option>
                  {PSU_TYPES.map((type) => (
                    <option key={type} value={type}>
                      Type {type}
                    </option>
                  ))}
                </select>
              )}
            </FormField>
            <NumberField
              label="Battery capacity (Ah)"
              hint={
                psuType === 'C'
                  ? 'A type C power supply has no standby battery of its own.'
                  : 'The standby battery’s rated capacity in ampere-hours, e.g. 7.'
              }
              error={errors.batteryAh?.message}
              registration={register('batteryAh', {
                setValueAs: numberOrNull,
                disabled: psuType === 'C',
              })}
              step="0.1"
              min="0"
              inputMode="decimal"
            />
            <NumberField
              label="Supply voltage (V)"
              hint="The charging voltage at the panel's detector supply terminals, usually 13.7 V."
              error={errors.supplyVolts?.message}
              registration={register('supplyVolts', { setValueAs: numberOrUndefined })}
              step="0.1"
              min="9"
              max="30"
              inputMode="decimal"
            />
            <NumberField
              label="Sounder cut-off (minutes)"
              hint={`How long the sounders ring in alarm: 1 to ${MAX_SOUNDER_MINUTES} minutes, as external sounders must stop within ${MAX_SOUNDER_MINUTES}. ${DEFAULT_SOUNDER_MINUTES} is usual. The power budget counts this time in alarm.`}
              error={errors.sounderMinutes?.message}
              registration={register('sounderMinutes', { setValueAs: numberOrUndefined })}
              step="1"
              min="1"
              max={MAX_SOUNDER_MINUTES}
              inputMode="numeric"
            />
            <NumberField
              label="Standby time override (hours)"
              optional
              hint={
                psuType === 'B' || psuType === 'C'
                  ? `Needed for a type ${psuType} supply: its standby time is not in Wardbook's table, so enter the time the site's specification requires. Without it there is no power budget.`
                  : "Needed for type B and C supplies, whose standby time is not in Wardbook's table. Leave empty for type A: the EN 50131-6 period for the site's grade is used."
              }
              error={errors.standbyHoursOverride?.message}
              registration={register('standbyHoursOverride', { setValueAs: numberOrNull })}
              step="any"
              min="0"
              inputMode="decimal"
            />
            <div className="md:col-span-2">
              <label className="flex min-h-10 items-start gap-3">
                <input
                  type="checkbox"
                  {...register('mainsFailureSignalled')}
                  aria-describedby="mains-failure-hint"
                  className={`${checkboxClassName} mt-1`}
                />
                <span>
                  <span className="block text-sm font-medium">Mains failure is signalled</span>
                  <span id="mains-failure-hint" className="block text-sm text-ink-muted">
                    Loss of mains is reported onward, to the monitoring centre or the user. It
                    shortens the standby time the battery must cover.
                  </span>
                </span>
              </label>
            </div>
          </div>
        </Card>

        <Card title="Loops and cable" icon={Cable} headingLevel={3}>
          <div className="grid gap-4 md:grid-cols-2">
            <FormField
              label="Resistor tolerance"
              hint="Of the end-of-line resistors fitted throughout (gold band ±5 %, brown ±1 %). It widens every zone's expected readings."
              error={errors.resistorTolerance?.message}
            >
              {(control) => (
                <select
                  {...control}
                  {...register('resistorTolerance', { setValueAs: numberOrUndefined })}
                  className={selectClassName({ className: 'max-w-56' })}
                >
                  {RESISTOR_TOLERANCES.map((tolerance) => (
                    <option key={tolerance} value={tolerance}>
                      ±{Math.round(tolerance * 100)} %
                    </option>
                  ))}
                </select>
              )}
            </FormField>
            <FormField
              label="Cable core"
              hint="The alarm cable's core build, for each zone's cable resistance and the volts at its detector."
              error={errors.cableCore?.message}
            >
              {(control) => (
                <select
                  {...control}
                  {...register('cableCore')}
                  className={selectClassName({ className: 'max-w-56' })}
                >
                  {CABLE_CORES.map((core) => (
                    <option key={core} value={core}>
                      {core} mm
                    </option>
                  ))}
                </select>
              )}
            </FormField>
          </div>
        </Card>

        <Card title="Signalling" icon={Radio} headingLevel={3}>
          <div className="grid gap-6">
            <FormField
              label="Notification option"
              hint="The notification option (A–F) of EN 50131-1 that the design meets."
              error={errors.notification?.message}
            >
              {(control) => (
                <select
                  {...control}
                  {...register('notification', { setValueAs: textOrNull })}
                  className={selectClassName({ className: 'max-w-56' })}
                >
                  <option value="">Not recorded</option>
                  {NOTIFICATION_OPTIONS.map((option) => (
                    <option key={option} value={option}>
                      Option {option}
                    </option>
                  ))}
                </select>
              )}
            </FormField>
            <SignallingPaths />
          </div>
        </Card>

        <Card title="Areas" icon={Layers} headingLevel={3}>
          <Areas />
        </Card>

        <SaveRow
          saveLabel="Save system"
          isSaving={saveSystem.isPending}
          savedMessage={isDirty ? '' : savedMessage}
        />
      </form>
    </FormProvider>
  );
}
