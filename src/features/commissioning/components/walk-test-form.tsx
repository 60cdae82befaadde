import { useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';

import type { WalkTest } from '@server/commissioning/schema';
import type { LoopDesign } from '@server/calc/loop';
import { STATE_NAMES } from '@server/calc/loop';
import type { Zone } from '@server/zones/schema';
import { Notice } from '@/components/ui/notice';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { LiveReading } from '@/components/ui/live-reading';
import { KeptOnPhoneOutcome } from '@/features/commissioning/components/record-outcome';
import {
  TouchCheckbox,
  TouchNoteField,
  TouchTextField,
} from '@/features/commissioning/components/touch-fields';
import { useDraft, withDraft } from '@/features/commissioning/utils/drafts';
import { newClientKey, type OutboxEntry } from '@/features/commissioning/utils/outbox';
import type { OutboxState } from '@/features/commissioning/utils/use-outbox';
import { applyServerFieldErrors, isUnderFields } from '@/lib/form-errors';
import { formatOhms, parseReading, type BandLike } from '@/lib/loop-readings';

type WalkTestValues = {
  secureReading: string;
  alarmReading: string;
  activated: boolean;
  note: string;
};

const BLANK: WalkTestValues = { secureReading: '', alarmReading: '', activated: false, note: '' };

const READING_HINT = 'As the meter shows it: 2210, 2k21, 2.21 kΩ, or OL for an open circuit.';

type Outcome =
  | { kind: 'verdict'; walkTest: WalkTest }
  | { kind: 'sent' }
  | { kind: 'kept-on-phone'; clientKey: string }
  | { kind: 'refused'; error: unknown; unplaced: string[] };

function describeReading(ohms: number | null, state: WalkTest['secureState'] | null) {
  const reading = ohms === null ? 'OL (open)' : formatOhms(ohms);
  return state ? `${reading}, ${STATE_NAMES[state].toLowerCase()}` : reading;
}

/** The API's verdict on a walk test, in plain words, with every reason it failed. */
function Verdict({ zone, walkTest }: { zone: Zone; walkTest: WalkTest }) {
  const readings = [
    `Secure ${describeReading(walkTest.secureReadingOhms, walkTest.secureState)}`,
    walkTest.alarmState
      ? `alarm ${describeReading(walkTest.alarmReadingOhms, walkTest.alarmState)}`
      : null,
  ]
    .filter(Boolean)
    .join('; ');
  return (
    <Notice
      tone={walkTest.passed ? 'normal' : 'alarm'}
      title={`Zone ${zone.number} ${walkTest.passed ? 'passed' : 'failed'} its walk test`}
    >
      <p>{readings}.</p>
      {walkTest.failures.map((failure) => (
        <p key={failure} className="mt-1 font-medium text-ink">
          {failure}
        </p>
      ))}
    </Notice>
  );
}

type WalkTestFormProps = {
  /** Whose drafts, for which site: "<user id>:<site id>". */
  draftScope: string;
  zone: Zone;
  design: LoopDesign | null;
  bands: readonly BandLike[];
  /** The form's id, for the save button in the sticky bar below it. */
  formId: string;
  submit: OutboxState['submit'];
  /** This zone's records waiting in the outbox. */
  onPhone: readonly OutboxEntry[];
};

/**
 * One zone's walk test: the secure reading, the alarm reading if taken, and whether the panel
 * showed the zone. The reading is classified live as it is typed; the API's verdict shows after
 * saving. Without a connection the test is kept on the phone and sent later.
 */
export function WalkTestForm({
  draftScope,
  zone,
  design,
  bands,
  formId,
  submit,
  onPhone,
}: WalkTestFormProps) {
  const draftName = `walk:${zone.id}`;
  const form = useForm<WalkTestValues>({ defaultValues: withDraft(draftScope, draftName, BLANK) });
  const clearDraft = useDraft(form, draftScope, draftName);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  // The save button sits outside the form, in the sticky bar: a second tap must not send twice.
  const isSaving = useRef(false);
  const {
    register,
    control,
    formState: { errors },
  } = form;
  const [secureReading, alarmReading] = useWatch({
    control,
    name: ['secureReading', 'alarmReading'],
  });

  const saveValues = async (values: WalkTestValues) => {
    if (isSaving.current) return;
    isSaving.current = true;
    setOutcome(null);
    const body = {
      clientKey: newClientKey(),
      zoneId: zone.id,
      secureReading: values.secureReading.trim(),
      alarmReading: values.alarmReading.trim() === '' ? null : values.alarmReading.trim(),
      activated: values.activated,
      note: values.note.trim(),
      // When it was done, on site: a test kept on the phone arrives later.
      testedAt: new Date().toISOString(),
    };
    try {
      const result = await submit({
        clientKey: body.clientKey,
        kind: 'walk-test',
        body,
        label: `Walk test of zone ${zone.number} (${zone.location})`,
        zoneId: zone.id,
        testKind: null,
        queuedAt: body.testedAt,
      });
      clearDraft();
      form.reset(BLANK);
      if (result.outcome === 'kept-on-phone') {
        setOutcome({ kind: 'kept-on-phone', clientKey: body.clientKey });
      } else if (result.reply?.kind === 'walk-test') {
        setOutcome({ kind: 'verdict', walkTest: result.reply.walkTest });
      } else {
        setOutcome({ kind: 'sent' });
      }
    } catch (error) {
      // Refused by the API: the typed values stay, and the reasons go beside their fields.
      const unplaced = applyServerFieldErrors(
        error,
        form.setError,
        isUnderFields(['secureReading', 'alarmReading', 'activated', 'note']),
      );
      setOutcome({ kind: 'refused', error, unplaced });
    } finally {
      isSaving.current = false;
    }
  };

  return (
    <form
      id={formId}
      noValidate
      onSubmit={(event) => void form.handleSubmit(saveValues)(event)}
      className="grid gap-4"
    >
      {outcome?.kind === 'refused' ? (
        <ProblemAlert
          error={outcome.error}
          leftoverFieldErrors={outcome.unplaced.map((message) => ({ path: '', message }))}
          hint="Nothing was saved. Put the marked fields right and save again."
        />
      ) : null}
      <TouchTextField
        label="Secure reading (Ω)"
        hint={`With the zone secure. ${READING_HINT}`}
        error={errors.secureReading?.message}
        reading
        registration={register('secureReading', {
          validate: (value) => {
            const reading = parseReading(value);
            if (reading.status === 'empty')
              return 'Enter the secure reading: ohms (2210), resistor code (2k21), or OL for an open circuit.';
            return reading.status === 'invalid' ? reading.message : true;
          },
        })}
      >
        <LiveReading
          text={secureReading}
          design={design}
          bands={bands}
          expected="normal"
          showGauge
        />
      </TouchTextField>
      <TouchTextField
        label="Alarm reading (Ω)"
        hint="With the detector in alarm, if you took one."
        optional
        error={errors.alarmReading?.message}
        reading
        registration={register('alarmReading', {
          validate: (value) => {
            const reading = parseReading(value);
            return reading.status === 'invalid' ? reading.message : true;
          },
        })}
      >
        <LiveReading text={alarmReading} design={design} bands={bands} expected="alarm" />
      </TouchTextField>
      <TouchCheckbox
        label="The panel showed the zone when I walked it"
        registration={register('activated')}
      />
      <TouchNoteField registration={register('note')} error={errors.note?.message} />
      {/* Always there, so what arrives in it after saving is announced. */}
      <div role="status">
        {outcome?.kind === 'verdict' ? <Verdict zone={zone} walkTest={outcome.walkTest} /> : null}
        {outcome?.kind === 'sent' ? (
          <Notice tone="normal" title={`Zone ${zone.number}: walk test saved`} />
        ) : null}
        {outcome?.kind === 'kept-on-phone' ? (
          <KeptOnPhoneOutcome
            clientKey={outcome.clientKey}
            onPhone={onPhone}
            what={`The walk test of zone ${zone.number}`}
          />
        ) : null}
      </div>
    </form>
  );
}
