import { useRef, useState, type FormEvent } from 'react';

import type { LoopDesign } from '@server/calc/loop';
import { LiveReading } from '@/components/ui/live-reading';
import { MAX_SIGNATURE_BYTES } from '@server/handover/schema';
import {
  CONFIDENCE_WORDS,
  preventiveCompletionSchema,
  type CompletedVisit,
  type PreventiveCompletionInput,
  type ServiceVisit,
} from '@server/service/schema';
import { Button } from '@/components/ui/button';
import { SignaturePad, type SignaturePadHandle } from '@/components/ui/signature-pad';
import { useCompleteVisit } from '@/features/service/api/complete-visit';
import {
  ChoiceGroup,
  VisitNoteField,
  VisitTextField,
  VisitFormProblems,
} from '@/features/service/components/visit-form-fields';
import {
  errorsFromApi,
  errorsFromIssues,
  type FieldErrors,
} from '@/features/service/utils/field-errors';
import { useCompletionKey } from '@/features/service/utils/completion-key';
import type { BandLike } from '@/lib/loop-readings';

export type VisitZone = {
  zoneId: string;
  number: number;
  location: string;
  design: LoopDesign | null;
  bands: readonly BandLike[];
};
export type VisitSignallingPath = { id: string; description: string };

type Outcome = 'passed' | 'failed';
type SounderOutcome = Outcome | 'none_fitted';
type NotTested = { chosen: boolean; reason: string };

type ZoneEntry = {
  secure: string;
  alarm: string;
  activated: 'yes' | 'no' | '';
  note: string;
  skipped: NotTested;
};
type CheckEntry<Result extends string> = {
  result: Result | 'not_tested' | '';
  note: string;
  reason: string;
};
type PathEntry = { result: Outcome | 'not_tested' | ''; centreReference: string; reason: string };

const notSkipped: NotTested = { chosen: false, reason: '' };
const PASS_FAIL = [
  { value: 'passed', label: 'Passed' },
  { value: 'failed', label: 'Failed' },
  { value: 'not_tested', label: 'Not tested' },
] as const;
const SOUNDER_CHOICES = [
  { value: 'passed', label: 'Passed' },
  { value: 'failed', label: 'Failed' },
  { value: 'none_fitted', label: 'None fitted' },
  { value: 'not_tested', label: 'Not tested' },
] as const;

const toNumber = (text: string): number | string => {
  const trimmed = text.trim().replace(',', '.');
  return trimmed !== '' && Number.isFinite(Number(trimmed)) ? Number(trimmed) : text;
};

type PreventiveVisitFormProps = {
  visit: ServiceVisit;
  zones: readonly VisitZone[];
  signallingPaths: readonly VisitSignallingPath[];
  onCompleted: (visit: CompletedVisit) => void;
};

/**
 * The preventive visit's checklist on a phone: battery, every zone's loop reading, tampers,
 * sounders, each signalling path, the customer's training and confidence, and the customer's
 * signature for anything left untested.
 */
export function PreventiveVisitForm({
  visit,
  zones,
  signallingPaths,
  onCompleted,
}: PreventiveVisitFormProps) {
  const clientKey = useCompletionKey(visit.id);
  const [battery, setBattery] = useState({
    resting: '',
    loaded: '',
    amps: '',
    skipped: notSkipped,
  });
  const [zoneEntries, setZoneEntries] = useState<Record<string, ZoneEntry>>(() =>
    Object.fromEntries(
      zones.map((zone) => [
        zone.zoneId,
        { secure: '', alarm: '', activated: '', note: '', skipped: notSkipped },
      ]),
    ),
  );
  const [tampers, setTampers] = useState<CheckEntry<Outcome>>({ result: '', note: '', reason: '' });
  const [internal, setInternal] = useState<CheckEntry<SounderOutcome>>({
    result: '',
    note: '',
    reason: '',
  });
  const [external, setExternal] = useState<CheckEntry<SounderOutcome>>({
    result: '',
    note: '',
    reason: '',
  });
  const [paths, setPaths] = useState<Record<string, PathEntry>>(() =>
    Object.fromEntries(
      signallingPaths.map((path) => [path.id, { result: '', centreReference: '', reason: '' }]),
    ),
  );
  const [training, setTraining] = useState<'yes' | 'no' | ''>('');
  const [confidence, setConfidence] = useState('');
  const [customerName, setCustomerName] = useState('');
  const [signature, setSignature] = useState('');
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [refusal, setRefusal] = useState<unknown>(null);
  const padRef = useRef<SignaturePadHandle>(null);
  const errorSummaryRef = useRef<HTMLDivElement>(null);
  const complete = useCompleteVisit({ mutationConfig: { onSuccess: onCompleted } });

  const updateZone = (zoneId: string, change: Partial<ZoneEntry>) =>
    setZoneEntries((current) => ({
      ...current,
      [zoneId]: { ...current[zoneId]!, ...change },
    }));
  const updatePath = (pathId: string, change: Partial<PathEntry>) =>
    setPaths((current) => ({ ...current, [pathId]: { ...current[pathId]!, ...change } }));

  // Each not-tested entry's place in the list, so an error about entry 3 lands beside its item.
  const notTestedKeys: string[] = [];
  const notTested: NonNullable<PreventiveCompletionInput['notTested']> = [];
  const skip = (key: string, entry: (typeof notTested)[number]) => {
    notTestedKeys.push(key);
    notTested.push(entry);
  };
  if (battery.skipped.chosen) skip('battery', { item: 'battery', reason: battery.skipped.reason });
  if (tampers.result === 'not_tested') skip('tampers', { item: 'tampers', reason: tampers.reason });
  if (internal.result === 'not_tested')
    skip('sounders.internal', { item: 'internal_sounders', reason: internal.reason });
  if (external.result === 'not_tested')
    skip('sounders.external', { item: 'external_sounders', reason: external.reason });
  for (const zone of zones) {
    const entry = zoneEntries[zone.zoneId]!;
    if (entry.skipped.chosen)
      skip(`zone:${zone.zoneId}`, {
        item: 'zone',
        zoneId: zone.zoneId,
        reason: entry.skipped.reason,
      });
  }
  for (const path of signallingPaths) {
    const entry = paths[path.id]!;
    if (entry.result === 'not_tested')
      skip(`path:${path.id}`, { item: 'signalling_path', pathId: path.id, reason: entry.reason });
  }
  const anythingNotTested = notTested.length > 0;

  const testedZones = zones.filter((zone) => !zoneEntries[zone.zoneId]!.skipped.chosen);
  const testedPaths = signallingPaths.filter((path) => {
    const result = paths[path.id]!.result;
    return result === 'passed' || result === 'failed' || result === '';
  });

  function buildBody(): PreventiveCompletionInput {
    const check = <Result extends string>(entry: CheckEntry<Result>) =>
      entry.result === '' || entry.result === 'not_tested'
        ? null
        : { result: entry.result, note: entry.note };
    return {
      kind: 'preventive',
      clientKey,
      completedAt: new Date().toISOString(),
      battery: battery.skipped.chosen
        ? null
        : {
            restingVolts: toNumber(battery.resting) as number,
            loadTestVolts: toNumber(battery.loaded) as number,
            loadTestAmps: battery.amps.trim() === '' ? null : (toNumber(battery.amps) as number),
          },
      zones: testedZones.map((zone) => {
        const entry = zoneEntries[zone.zoneId]!;
        return {
          zoneId: zone.zoneId,
          secureReading: entry.secure,
          alarmReading: entry.alarm.trim() === '' ? null : entry.alarm,
          activated: (entry.activated === '' ? undefined : entry.activated === 'yes') as boolean,
          note: entry.note,
        };
      }),
      tampers: check(tampers) as PreventiveCompletionInput['tampers'],
      sounders: {
        internal: check(internal) as NonNullable<PreventiveCompletionInput['sounders']>['internal'],
        external: check(external) as NonNullable<PreventiveCompletionInput['sounders']>['external'],
      },
      signalling: testedPaths.map((path) => {
        const entry = paths[path.id]!;
        return {
          pathId: path.id,
          result: (entry.result || undefined) as Outcome,
          centreReference: entry.centreReference,
        };
      }),
      userTrainingGiven: (training === '' ? undefined : training === 'yes') as boolean,
      userConfidence: (confidence === '' ? undefined : Number(confidence)) as number,
      notTested,
      ...(anythingNotTested
        ? {
            customerName: customerName.trim() === '' ? undefined : customerName,
            customerSignature: signature === '' ? undefined : signature,
          }
        : {}),
      note,
    };
  }

  // Errors on the not-tested list are shown beside the item they are about.
  function placeErrors(found: FieldErrors): FieldErrors {
    const placed: FieldErrors = {};
    for (const [path, message] of Object.entries(found)) {
      const match = /^notTested\.(\d+)/.exec(path);
      const key = match ? notTestedKeys[Number(match[1])] : undefined;
      if (key) placed[`notTested:${key}`] ??= message;
      else {
        // Rows are sent only for tested zones and paths: map the row back to its id.
        const zoneRow = /^zones\.(\d+)\.(\w+)/.exec(path);
        const pathRow = /^signalling\.(\d+)\.(\w+)/.exec(path);
        if (zoneRow)
          placed[`zone:${testedZones[Number(zoneRow[1])]?.zoneId}.${zoneRow[2]}`] ??= message;
        else if (pathRow)
          placed[`path:${testedPaths[Number(pathRow[1])]?.id}.${pathRow[2]}`] ??= message;
        else placed[path] ??= message;
      }
    }
    return placed;
  }

  async function submit(event: FormEvent) {
    event.preventDefault();
    setRefusal(null);
    const body = buildBody();
    const checked = preventiveCompletionSchema.safeParse(body);
    if (!checked.success) {
      setErrors(placeErrors(errorsFromIssues(checked.error.issues)));
      requestAnimationFrame(() => errorSummaryRef.current?.focus());
      return;
    }
    setErrors({});
    try {
      await complete.mutateAsync({ siteId: visit.siteId, visitId: visit.id, data: body });
    } catch (error) {
      setRefusal(error);
      setErrors(placeErrors(errorsFromApi(error)));
      requestAnimationFrame(() => errorSummaryRef.current?.focus());
    }
  }

  const errorCount = Object.keys(errors).length;
  const section = 'grid gap-4 rounded-lg border border-hairline bg-white px-4 py-4';
  const heading = 'text-lg font-semibold';

  return (
    <form
      noValidate
      onSubmit={submit}
      aria-label="Preventive visit checklist"
      className="grid gap-5"
    >
      <VisitFormProblems
        summaryRef={errorSummaryRef}
        refusal={refusal}
        errorCount={errorCount}
        notDone="The visit was not completed."
      />

      <section aria-labelledby="battery-heading" className={section}>
        <h2 id="battery-heading" className={heading}>
          Standby battery
        </h2>
        <label className="flex min-h-12 items-center gap-3">
          <input
            type="checkbox"
            checked={battery.skipped.chosen}
            onChange={(event) =>
              setBattery({
                ...battery,
                skipped: { ...battery.skipped, chosen: event.target.checked },
              })
            }
            className="size-6 accent-ink"
          />
          <span>Battery not tested</span>
        </label>
        {battery.skipped.chosen ? (
          <VisitTextField
            label="Why the battery was not tested"
            value={battery.skipped.reason}
            onChange={(reason) => setBattery({ ...battery, skipped: { chosen: true, reason } })}
            error={errors['notTested:battery']}
          />
        ) : (
          <>
            <VisitTextField
              label="Volts at rest"
              hint="Mains on, battery on charge."
              reading
              inputMode="decimal"
              value={battery.resting}
              onChange={(resting) => setBattery({ ...battery, resting })}
              error={errors['battery.restingVolts'] ?? errors.battery}
            />
            <VisitTextField
              label="Volts under load"
              hint="Mains off, at the end of the load test."
              reading
              inputMode="decimal"
              value={battery.loaded}
              onChange={(loaded) => setBattery({ ...battery, loaded })}
              error={errors['battery.loadTestVolts']}
            />
            <VisitTextField
              label="Load current in amps"
              optional
              reading
              inputMode="decimal"
              value={battery.amps}
              onChange={(amps) => setBattery({ ...battery, amps })}
              error={errors['battery.loadTestAmps']}
            />
            <p className="text-sm text-ink-muted">
              The verdict on the battery is shown once the visit is saved.
            </p>
          </>
        )}
      </section>

      <section aria-labelledby="zones-heading" className={section}>
        <h2 id="zones-heading" className={heading}>
          Zones
        </h2>
        {zones.length === 0 ? (
          <p className="text-ink-muted">No zones are on the schedule.</p>
        ) : null}
        <ol className="grid gap-4">
          {zones.map((zone) => {
            const entry = zoneEntries[zone.zoneId]!;
            const zoneName = `Zone ${zone.number} ${zone.location}`;
            const zoneError = (field: string) => errors[`zone:${zone.zoneId}.${field}`];
            return (
              <li
                key={zone.zoneId}
                className="grid gap-3 rounded-md border border-hairline px-3 py-3"
              >
                <h3 className="font-semibold">
                  <span className="font-mono">{zone.number}</span> {zone.location}
                </h3>
                <label className="flex min-h-12 items-center gap-3">
                  <input
                    type="checkbox"
                    checked={entry.skipped.chosen}
                    onChange={(event) =>
                      updateZone(zone.zoneId, {
                        skipped: { ...entry.skipped, chosen: event.target.checked },
                      })
                    }
                    className="size-6 accent-ink"
                  />
                  <span>{zoneName}: not tested</span>
                </label>
                {entry.skipped.chosen ? (
                  <VisitTextField
                    label={`Why ${zoneName} was not tested`}
                    value={entry.skipped.reason}
                    onChange={(reason) =>
                      updateZone(zone.zoneId, { skipped: { chosen: true, reason } })
                    }
                    error={errors[`notTested:zone:${zone.zoneId}`]}
                  />
                ) : (
                  <>
                    <VisitTextField
                      label={`${zoneName}: secure reading`}
                      hint="Ohms as the meter shows them (2k21, 2210), or OL for an open circuit."
                      reading
                      value={entry.secure}
                      onChange={(secure) => updateZone(zone.zoneId, { secure })}
                      error={zoneError('secureReading')}
                    >
                      <LiveReading
                        text={entry.secure}
                        design={zone.design}
                        bands={zone.bands}
                        expected="normal"
                        showGauge
                      />
                    </VisitTextField>
                    <VisitTextField
                      label={`${zoneName}: reading in alarm`}
                      optional
                      reading
                      value={entry.alarm}
                      onChange={(alarm) => updateZone(zone.zoneId, { alarm })}
                      error={zoneError('alarmReading')}
                    >
                      <LiveReading
                        text={entry.alarm}
                        design={zone.design}
                        bands={zone.bands}
                        expected="alarm"
                      />
                    </VisitTextField>
                    <ChoiceGroup
                      legend={`${zoneName}: did the panel show it when walked?`}
                      name={`activated-${zone.zoneId}`}
                      value={entry.activated}
                      choices={[
                        { value: 'yes', label: 'Yes' },
                        { value: 'no', label: 'No' },
                      ]}
                      onChange={(activated) => updateZone(zone.zoneId, { activated })}
                      error={zoneError('activated')}
                    />
                    <VisitNoteField
                      label={`${zoneName}: note`}
                      value={entry.note}
                      onChange={(zoneNote) => updateZone(zone.zoneId, { note: zoneNote })}
                      error={zoneError('note')}
                    />
                  </>
                )}
              </li>
            );
          })}
        </ol>
      </section>

      <section aria-labelledby="tampers-heading" className={section}>
        <h2 id="tampers-heading" className={heading}>
          Tampers and sounders
        </h2>
        <CheckItem
          label="Tampers"
          name="tampers"
          entry={tampers}
          choices={PASS_FAIL}
          onChange={setTampers}
          error={errors.tampers ?? errors['tampers.result']}
          reasonError={errors['notTested:tampers']}
        />
        <CheckItem
          label="Internal sounders"
          name="internal-sounders"
          entry={internal}
          choices={SOUNDER_CHOICES}
          onChange={setInternal}
          error={errors['sounders.internal'] ?? errors['sounders.internal.result']}
          reasonError={errors['notTested:sounders.internal']}
        />
        <CheckItem
          label="External sounders"
          name="external-sounders"
          entry={external}
          choices={SOUNDER_CHOICES}
          onChange={setExternal}
          error={errors['sounders.external'] ?? errors['sounders.external.result']}
          reasonError={errors['notTested:sounders.external']}
        />
      </section>

      <section aria-labelledby="signalling-heading" className={section}>
        <h2 id="signalling-heading" className={heading}>
          Signalling
        </h2>
        {signallingPaths.length === 0 ? (
          <p className="text-ink-muted">No signalling paths are recorded for this system.</p>
        ) : null}
        {signallingPaths.map((path) => {
          const entry = paths[path.id]!;
          return (
            <div key={path.id} className="grid gap-3">
              <ChoiceGroup
                legend={path.description}
                name={`path-${path.id}`}
                value={entry.result}
                choices={PASS_FAIL}
                onChange={(result) => updatePath(path.id, { result })}
                error={errors[`path:${path.id}.result`] ?? errors[`path:${path.id}.pathId`]}
              />
              {entry.result === 'not_tested' ? (
                <VisitTextField
                  label={`Why ${path.description} was not tested`}
                  value={entry.reason}
                  onChange={(reason) => updatePath(path.id, { reason })}
                  error={errors[`notTested:path:${path.id}`]}
                />
              ) : (
                <VisitTextField
                  label={`${path.description}: the centre’s reference`}
                  optional
                  value={entry.centreReference}
                  onChange={(centreReference) => updatePath(path.id, { centreReference })}
                  error={errors[`path:${path.id}.centreReference`]}
                />
              )}
            </div>
          );
        })}
      </section>

      <section aria-labelledby="customer-heading" className={section}>
        <h2 id="customer-heading" className={heading}>
          The customer
        </h2>
        <ChoiceGroup
          legend="Did you go through using the system with the customer?"
          name="training"
          value={training}
          choices={[
            { value: 'yes', label: 'Yes' },
            { value: 'no', label: 'No' },
          ]}
          onChange={setTraining}
          error={errors.userTrainingGiven}
        />
        <ChoiceGroup
          legend="How confident is the customer using the system?"
          name="confidence"
          value={confidence}
          choices={CONFIDENCE_WORDS.map((words, index) => ({
            value: String(index + 1),
            label: `${index + 1}: ${words}`,
          }))}
          onChange={setConfidence}
          error={errors.userConfidence}
        />
        <VisitNoteField label="Visit note" value={note} onChange={setNote} error={errors.note} />
      </section>

      {anythingNotTested ? (
        <section aria-labelledby="not-tested-heading" className={section}>
          <h2 id="not-tested-heading" className={heading}>
            Not tested: the customer signs
          </h2>
          <ul className="list-disc pl-5">
            {notTested.map((entry, index) => (
              <li key={notTestedKeys[index]}>
                {describeNotTested(entry, zones, signallingPaths)}
                {entry.reason.trim() ? `: ${entry.reason.trim()}` : ''}
              </li>
            ))}
          </ul>
          <VisitTextField
            label="Customer’s full name"
            value={customerName}
            onChange={setCustomerName}
            error={errors.customerName}
          />
          <SignaturePad
            ref={padRef}
            label="Customer’s signature"
            onChange={setSignature}
            maxImageBytes={MAX_SIGNATURE_BYTES}
            error={errors.customerSignature}
          />
          <p className="text-sm">
            By signing, the customer accepts that the items above were not tested on this visit.
          </p>
        </section>
      ) : null}

      <Button type="submit" variant="primary" size="lg" disabled={complete.isPending}>
        {complete.isPending ? 'Sending…' : 'Complete the visit'}
      </Button>
    </form>
  );
}

function describeNotTested(
  entry: NonNullable<PreventiveCompletionInput['notTested']>[number],
  zones: readonly VisitZone[],
  signallingPaths: readonly VisitSignallingPath[],
): string {
  switch (entry.item) {
    case 'battery':
      return 'Battery';
    case 'tampers':
      return 'Tampers';
    case 'internal_sounders':
      return 'Internal sounders';
    case 'external_sounders':
      return 'External sounders';
    case 'zone': {
      const zone = zones.find((candidate) => candidate.zoneId === entry.zoneId);
      return zone ? `Zone ${zone.number} ${zone.location}` : 'A zone';
    }
    case 'signalling_path':
      return (
        signallingPaths.find((path) => path.id === entry.pathId)?.description ?? 'A signalling path'
      );
  }
}

type CheckItemProps<Result extends string> = {
  label: string;
  name: string;
  entry: CheckEntry<Result>;
  choices: readonly { value: Result | 'not_tested'; label: string }[];
  onChange: (entry: CheckEntry<Result>) => void;
  error?: string;
  reasonError?: string;
};

function CheckItem<Result extends string>({
  label,
  name,
  entry,
  choices,
  onChange,
  error,
  reasonError,
}: CheckItemProps<Result>) {
  return (
    <div className="grid gap-3">
      <ChoiceGroup
        legend={label}
        name={name}
        value={entry.result}
        choices={choices}
        onChange={(result) => onChange({ ...entry, result })}
        error={error}
      />
      {entry.result === 'not_tested' ? (
        <VisitTextField
          label={`Why the ${label.toLowerCase()} were not tested`}
          value={entry.reason}
          onChange={(reason) => onChange({ ...entry, reason })}
          error={reasonError}
        />
      ) : entry.result !== '' ? (
        <VisitNoteField
          label={`${label}: note`}
          value={entry.note}
          onChange={(checkNote) => onChange({ ...entry, note: checkNote })}
        />
      ) : null}
    </div>
  );
}
