import { useRef, useState, type ReactNode } from 'react';
import {
  BatteryCharging,
  CircleCheck,
  Info,
  Megaphone,
  RadioTower,
  Siren,
  type LucideIcon,
} from 'lucide-react';
import { useForm, useWatch, type FieldValues, type UseFormReturn } from 'react-hook-form';

import { BATTERY_MIN_LOADED_VOLTS, BATTERY_MIN_RESTING_VOLTS } from '@server/commissioning/schema';
import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { Notice } from '@/components/ui/notice';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { touchInputClassName } from '@/components/ui/touch-field-styles';
import type {
  SystemTestKind,
  SystemTestRecord,
} from '@/features/commissioning/api/get-commissioning';
import { KeptOnPhoneOutcome } from '@/features/commissioning/components/record-outcome';
import { TestStatusBadge } from '@/features/commissioning/components/test-status';
import {
  TouchCheckbox,
  TouchNoteField,
  TouchTextField,
} from '@/features/commissioning/components/touch-fields';
import { useDraft, withDraft } from '@/features/commissioning/utils/drafts';
import { newClientKey, type OutboxEntry } from '@/features/commissioning/utils/outbox';
import { statusOf } from '@/features/commissioning/utils/test-status';
import type { OutboxState } from '@/features/commissioning/utils/use-outbox';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { cn } from '@/utils/cn';
import { formatDateTime } from '@/utils/format';

const TEST_NAMES: Record<SystemTestKind, string> = {
  sounders: 'Sounder test',
  signalling: 'Signalling test',
  battery: 'Battery test',
};

type Outcome =
  | { kind: 'saved'; passed: boolean | null }
  | { kind: 'kept-on-phone'; clientKey: string }
  | { kind: 'refused'; error: unknown; unplaced: string[] };

type SaveContext = {
  /** Whose drafts, for which site: "<user id>:<site id>". */
  draftScope: string;
  submit: OutboxState['submit'];
};

/**
 * Saves a system test: now if there is a connection, on the phone if not. A refusal keeps what
 * was typed and puts the reasons beside the fields.
 */
function useSystemTestSave<Values extends FieldValues>(
  kind: SystemTestKind,
  form: UseFormReturn<Values>,
  blank: Values,
  clearDraft: () => void,
  { submit }: SaveContext,
) {
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const isSaving = useRef(false);
  const save = async (fields: Record<string, unknown>) => {
    if (isSaving.current) return;
    isSaving.current = true;
    setOutcome(null);
    const testedAt = new Date().toISOString();
    const entry: OutboxEntry = {
      clientKey: newClientKey(),
      kind: 'system-test',
      body: { ...fields, kind, testedAt },
      label: TEST_NAMES[kind],
      zoneId: null,
      testKind: kind,
      queuedAt: testedAt,
    };
    entry.body.clientKey = entry.clientKey;
    try {
      const result = await submit(entry);
      clearDraft();
      form.reset(blank);
      if (result.outcome === 'kept-on-phone') {
        setOutcome({ kind: 'kept-on-phone', clientKey: entry.clientKey });
      } else {
        const passed = result.reply?.kind === 'system-test' ? result.reply.passed : null;
        setOutcome({ kind: 'saved', passed });
      }
    } catch (error) {
      const unplaced = applyServerFieldErrors(error, form.setError, (path) =>
        Object.keys(blank).includes(path),
      );
      setOutcome({ kind: 'refused', error, unplaced });
    } finally {
      isSaving.current = false;
    }
  };
  return { outcome, save };
}

function OutcomeView({
  kind,
  outcome,
  onPhone,
}: {
  kind: SystemTestKind;
  outcome: Outcome | null;
  onPhone: readonly OutboxEntry[];
}) {
  return (
    <>
      {outcome?.kind === 'refused' ? (
        <ProblemAlert
          error={outcome.error}
          leftoverFieldErrors={outcome.unplaced.map((message) => ({ path: '', message }))}
          hint="Nothing was saved. Put the marked fields right and save again."
        />
      ) : null}
      {/* Always there, so what arrives in it after saving is announced. */}
      <div role="status">
        {outcome?.kind === 'kept-on-phone' ? (
          <KeptOnPhoneOutcome
            clientKey={outcome.clientKey}
            onPhone={onPhone}
            what={`The ${TEST_NAMES[kind].toLowerCase()}`}
          />
        ) : null}
        {outcome?.kind === 'saved' ? (
          <Notice
            tone={outcome.passed === false ? 'alarm' : 'normal'}
            title={`${TEST_NAMES[kind]} saved${outcome.passed === null ? '' : outcome.passed ? ': passed' : ': failed'}`}
          />
        ) : null}
      </div>
    </>
  );
}

const detailsOf = (test: SystemTestRecord | undefined): Record<string, unknown> =>
  test && typeof test.details === 'object' && test.details !== null
    ? (test.details as Record<string, unknown>)
    : {};

function lastTestWords(kind: SystemTestKind, test: SystemTestRecord | undefined): string {
  if (!test) return 'Not tested yet.';
  const details = detailsOf(test);
  const when = `${formatDateTime(test.testedAt)}${test.testedBy ? ` by ${test.testedBy}` : ''}`;
  const yes = (name: string) => details[name] === true;
  switch (kind) {
    case 'sounders':
      return `Last test ${when}: internal ${yes('internalSounded') ? 'sounded' : 'did not sound'}, external ${yes('externalSounded') ? 'sounded' : 'did not sound'}, strobe ${yes('strobeFlashed') ? 'flashed' : 'did not flash'}.`;
    case 'signalling':
      return `Last test ${when}: path ${String(details.pathPosition ?? '?')}, ${yes('receivedByCentre') ? 'received by the centre' : 'not received by the centre'}${details.centreReference ? ` (reference ${String(details.centreReference)})` : ''}.`;
    case 'battery':
      return `Last test ${when}: ${String(details.restingVolts ?? '?')} V resting, ${String(details.loadVolts ?? '?')} V under ${String(details.loadAmps ?? '?')} A for ${String(details.loadMinutes ?? '?')} min.`;
  }
}

type TestCardProps = {
  kind: SystemTestKind;
  icon: LucideIcon;
  lastTest: SystemTestRecord | undefined;
  onPhone: readonly OutboxEntry[];
  intro: ReactNode;
  children: ReactNode;
};

function TestCard({ kind, icon: Icon, lastTest, onPhone, intro, children }: TestCardProps) {
  const headingId = `system-test-${kind}-heading`;
  return (
    <section
      aria-labelledby={headingId}
      className="grid gap-3 rounded-lg border border-hairline bg-white p-3 md:p-4"
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={headingId} className="flex items-center gap-2 text-lg font-semibold">
          <Icon aria-hidden="true" className="size-5 shrink-0" />
          {TEST_NAMES[kind]}
        </h3>
        <TestStatusBadge status={statusOf(lastTest ?? null, [...onPhone])} />
      </div>
      <p className="text-sm text-ink-muted">{lastTestWords(kind, lastTest)}</p>
      <div className="text-sm">{intro}</div>
      {children}
    </section>
  );
}

type SystemTestFormProps = SaveContext & {
  lastTest: SystemTestRecord | undefined;
  onPhone: readonly OutboxEntry[];
};

type SounderValues = {
  internalSounded: boolean;
  externalSounded: boolean;
  strobeFlashed: boolean;
  note: string;
};
const SOUNDERS_BLANK: SounderValues = {
  internalSounded: false,
  externalSounded: false,
  strobeFlashed: false,
  note: '',
};

export function SounderTestForm({ lastTest, onPhone, ...context }: SystemTestFormProps) {
  const form = useForm<SounderValues>({
    defaultValues: withDraft(context.draftScope, 'sounders', SOUNDERS_BLANK),
  });
  const clearDraft = useDraft(form, context.draftScope, 'sounders');
  const { outcome, save } = useSystemTestSave(
    'sounders',
    form,
    SOUNDERS_BLANK,
    clearDraft,
    context,
  );
  return (
    <TestCard
      kind="sounders"
      icon={Megaphone}
      lastTest={lastTest}
      onPhone={onPhone}
      intro="A pass needs both the internal and the external sounder to sound. Tell the neighbours before sounding the external one."
    >
      <form
        noValidate
        className="grid gap-2"
        onSubmit={form.handleSubmit((values) => save({ ...values, note: values.note.trim() }))}
      >
        <TouchCheckbox
          label="Internal sounder sounded"
          registration={form.register('internalSounded')}
        />
        <TouchCheckbox
          label="External sounder sounded"
          registration={form.register('externalSounded')}
        />
        <TouchCheckbox label="Strobe flashed" registration={form.register('strobeFlashed')} />
        <TouchNoteField
          label="Sounder test note"
          registration={form.register('note')}
          error={form.formState.errors.note?.message}
        />
        <div>
          <Button type="submit" size="lg">
            Save sounder test
          </Button>
        </div>
        <OutcomeView kind="sounders" outcome={outcome} onPhone={onPhone} />
      </form>
    </TestCard>
  );
}

type SignallingValues = {
  pathPosition: string;
  receivedByCentre: boolean;
  centreReference: string;
  note: string;
};
const SIGNALLING_BLANK: SignallingValues = {
  pathPosition: '1',
  receivedByCentre: false,
  centreReference: '',
  note: '',
};

export type SignallingPathChoice = { position: number; description: string };

export function SignallingTestForm({
  lastTest,
  onPhone,
  paths,
  monitored,
  ...context
}: SystemTestFormProps & { paths: readonly SignallingPathChoice[]; monitored: boolean }) {
  const form = useForm<SignallingValues>({
    defaultValues: withDraft(context.draftScope, 'signalling', SIGNALLING_BLANK),
  });
  const clearDraft = useDraft(form, context.draftScope, 'signalling');
  const { outcome, save } = useSystemTestSave(
    'signalling',
    form,
    SIGNALLING_BLANK,
    clearDraft,
    context,
  );
  const errors = form.formState.errors;
  const choices: SignallingPathChoice[] =
    paths.length > 0
      ? [...paths]
      : [1, 2, 3, 4].map((position) => ({ position, description: `Path ${position}` }));
  return (
    <TestCard
      kind="signalling"
      icon={RadioTower}
      lastTest={lastTest}
      onPhone={onPhone}
      intro={
        monitored
          ? 'Send a test signal down each path and ask the monitoring centre whether it arrived. A pass needs the centre to have received it.'
          : 'This site is not monitored, so the pre-issue check does not ask for a signalling test.'
      }
    >
      <form
        noValidate
        className="grid gap-3"
        onSubmit={form.handleSubmit((values) =>
          save({
            pathPosition: Number(values.pathPosition),
            receivedByCentre: values.receivedByCentre,
            centreReference: values.centreReference.trim(),
            note: values.note.trim(),
          }),
        )}
      >
        <FormField label="Signalling path" error={errors.pathPosition?.message}>
          {(control) => (
            <select
              {...control}
              {...form.register('pathPosition')}
              className={touchInputClassName({ invalid: Boolean(errors.pathPosition) })}
            >
              {choices.map((path) => (
                <option key={path.position} value={path.position}>
                  {path.description}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <TouchCheckbox
          label="Received by the monitoring centre"
          registration={form.register('receivedByCentre')}
        />
        <TouchTextField
          label="Centre’s reference"
          hint="The reference the centre gave for the test signal."
          optional
          reading
          error={errors.centreReference?.message}
          registration={form.register('centreReference')}
        />
        <TouchNoteField
          label="Signalling test note"
          registration={form.register('note')}
          error={errors.note?.message}
        />
        <div>
          <Button type="submit" size="lg">
            Save signalling test
          </Button>
        </div>
        <OutcomeView kind="signalling" outcome={outcome} onPhone={onPhone} />
      </form>
    </TestCard>
  );
}

type BatteryValues = {
  restingVolts: string;
  loadVolts: string;
  loadAmps: string;
  loadMinutes: string;
  note: string;
};
const BATTERY_BLANK: BatteryValues = {
  restingVolts: '',
  loadVolts: '',
  loadAmps: '',
  loadMinutes: '',
  note: '',
};

const needNumber = (message: string) => (value: string) =>
  (value.trim() !== '' && Number.isFinite(Number(value))) || message;

function BatteryVerdict({ control }: { control: UseFormReturn<BatteryValues>['control'] }) {
  const [resting, loaded] = useWatch({ control, name: ['restingVolts', 'loadVolts'] });
  const restingVolts = resting.trim() === '' ? Number.NaN : Number(resting);
  const loadVolts = loaded.trim() === '' ? Number.NaN : Number(loaded);
  if (!Number.isFinite(restingVolts) || !Number.isFinite(loadVolts)) return null;
  const passes = restingVolts >= BATTERY_MIN_RESTING_VOLTS && loadVolts >= BATTERY_MIN_LOADED_VOLTS;
  const Icon = passes ? CircleCheck : Siren;
  return (
    <p
      className={cn(
        'flex items-start gap-2 rounded-md border border-l-4 border-hairline bg-white p-3 text-sm font-semibold',
        passes ? 'border-l-normal' : 'border-l-alarm',
      )}
    >
      <Icon
        aria-hidden="true"
        className={cn('mt-0.5 size-5 shrink-0', passes ? 'text-normal' : 'text-alarm')}
      />
      <span>
        {passes ? 'Would pass' : 'Would fail'}: {restingVolts} V resting (needs{' '}
        {BATTERY_MIN_RESTING_VOLTS} V or more), {loadVolts} V under load (needs{' '}
        {BATTERY_MIN_LOADED_VOLTS.toFixed(1)} V or more).
      </span>
    </p>
  );
}

export function BatteryTestForm({ lastTest, onPhone, ...context }: SystemTestFormProps) {
  const form = useForm<BatteryValues>({
    defaultValues: withDraft(context.draftScope, 'battery', BATTERY_BLANK),
  });
  const clearDraft = useDraft(form, context.draftScope, 'battery');
  const { outcome, save } = useSystemTestSave('battery', form, BATTERY_BLANK, clearDraft, context);
  const errors = form.formState.errors;
  const { register } = form;
  return (
    <TestCard
      kind="battery"
      icon={BatteryCharging}
      lastTest={lastTest}
      onPhone={onPhone}
      intro={
        <p className="flex items-start gap-2">
          <Info aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-info" />
          <span>
            A sound 12 V battery rests at {BATTERY_MIN_RESTING_VOLTS} V or more and holds{' '}
            {BATTERY_MIN_LOADED_VOLTS.toFixed(1)} V or more under load (common practice). Keep tools
            clear of both terminals at once.
          </span>
        </p>
      }
    >
      <form
        noValidate
        className="grid gap-3"
        onSubmit={form.handleSubmit((values) =>
          save({
            restingVolts: Number(values.restingVolts),
            loadVolts: Number(values.loadVolts),
            loadAmps: Number(values.loadAmps),
            loadMinutes: Number(values.loadMinutes),
            note: values.note.trim(),
          }),
        )}
      >
        <div className="grid gap-3 sm:grid-cols-2">
          <TouchTextField
            label="Resting voltage (V)"
            hint="Off charge, at rest, e.g. 12.8."
            reading
            inputMode="decimal"
            error={errors.restingVolts?.message}
            registration={register('restingVolts', {
              validate: needNumber('Enter the resting voltage, e.g. 12.8.'),
            })}
          />
          <TouchTextField
            label="Voltage under load (V)"
            hint="At the end of the load time, e.g. 12.3."
            reading
            inputMode="decimal"
            error={errors.loadVolts?.message}
            registration={register('loadVolts', {
              validate: needNumber('Enter the voltage under load, e.g. 12.3.'),
            })}
          />
          <TouchTextField
            label="Load current (A)"
            hint="The test load, e.g. 1.5."
            reading
            inputMode="decimal"
            error={errors.loadAmps?.message}
            registration={register('loadAmps', {
              validate: needNumber('Enter the load current in amps, e.g. 1.5.'),
            })}
          />
          <TouchTextField
            label="Load time (minutes)"
            hint="How long the load was on, e.g. 10."
            reading
            inputMode="numeric"
            error={errors.loadMinutes?.message}
            registration={register('loadMinutes', {
              validate: needNumber('Enter how many minutes the load was on, e.g. 10.'),
            })}
          />
        </div>
        <BatteryVerdict control={form.control} />
        <TouchNoteField
          label="Battery test note"
          registration={register('note')}
          error={errors.note?.message}
        />
        <div>
          <Button type="submit" size="lg">
            Save battery test
          </Button>
        </div>
        <OutcomeView kind="battery" outcome={outcome} onPhone={onPhone} />
      </form>
    </TestCard>
  );
}
