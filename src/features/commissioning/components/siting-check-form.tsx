import { useState } from 'react';
import { Crosshair } from 'lucide-react';
import { useForm } from 'react-hook-form';

import { SITING_ITEM_LABELS, SITING_ITEMS, type SitingItem } from '@server/commissioning/schema';
import type { Zone } from '@server/zones/schema';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ProblemAlert } from '@/components/ui/problem-alert';
import type { CommissioningZone } from '@/features/commissioning/api/get-commissioning';
import { KeptOnPhoneOutcome } from '@/features/commissioning/components/record-outcome';
import { TouchCheckbox, TouchNoteField } from '@/features/commissioning/components/touch-fields';
import { useDraft, withDraft } from '@/features/commissioning/utils/drafts';
import { newClientKey, type OutboxEntry } from '@/features/commissioning/utils/outbox';
import type { OutboxState } from '@/features/commissioning/utils/use-outbox';
import { formatDateTime } from '@/utils/format';

type SitingValues = { answers: Record<SitingItem, boolean>; note: string };

const BLANK: SitingValues = {
  answers: Object.fromEntries(SITING_ITEMS.map((item) => [item, false])) as Record<
    SitingItem,
    boolean
  >,
  note: '',
};

type Outcome =
  | { kind: 'saved'; allClear: boolean | null }
  | { kind: 'kept-on-phone'; clientKey: string }
  | { kind: 'refused'; error: unknown };

type SitingCheckFormProps = {
  /** Whose drafts, for which site: "<user id>:<site id>". */
  draftScope: string;
  zone: Zone;
  lastCheck: CommissioningZone['siting'];
  submit: OutboxState['submit'];
  onPhone: readonly OutboxEntry[];
};

/**
 * The siting checklist for a movement detector: tick what holds. Anything left unticked is
 * recorded as something to put right, and the pre-issue check advises on it.
 */
export function SitingCheckForm({
  draftScope,
  zone,
  lastCheck,
  submit,
  onPhone,
}: SitingCheckFormProps) {
  const draftName = `siting:${zone.id}`;
  const form = useForm<SitingValues>({ defaultValues: withDraft(draftScope, draftName, BLANK) });
  const clearDraft = useDraft(form, draftScope, draftName);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const headingId = `siting-${zone.id}-heading`;

  const save = form.handleSubmit(async (values) => {
    setOutcome(null);
    const testedAt = new Date().toISOString();
    const body = {
      clientKey: newClientKey(),
      zoneId: zone.id,
      answers: values.answers,
      note: values.note.trim(),
      testedAt,
    };
    try {
      const result = await submit({
        clientKey: body.clientKey,
        kind: 'siting-check',
        body,
        label: `Siting check of zone ${zone.number} (${zone.location})`,
        zoneId: zone.id,
        testKind: null,
        queuedAt: testedAt,
      });
      clearDraft();
      form.reset(BLANK);
      if (result.outcome === 'kept-on-phone') {
        setOutcome({ kind: 'kept-on-phone', clientKey: body.clientKey });
      } else {
        const allClear = result.reply?.kind === 'siting-check' ? result.reply.allClear : null;
        setOutcome({ kind: 'saved', allClear });
      }
    } catch (error) {
      setOutcome({ kind: 'refused', error });
    }
  });

  return (
    <section aria-labelledby={headingId} className="grid gap-3 border-t border-hairline pt-4">
      <h4 id={headingId} className="flex items-center gap-2 font-semibold">
        <Crosshair aria-hidden="true" className="size-5 shrink-0" />
        Siting checklist
      </h4>
      <p className="text-sm text-ink-muted">
        Tick each that holds for this detector. Anything left unticked is recorded as something to
        put right.
        {lastCheck
          ? ` Last checked ${formatDateTime(lastCheck.checkedAt)}: ${lastCheck.allClear ? 'all clear' : 'something to put right'}.`
          : ' Not checked yet.'}
      </p>
      <form noValidate onSubmit={save} className="grid gap-2">
        {outcome?.kind === 'refused' ? <ProblemAlert error={outcome.error} /> : null}
        <fieldset className="grid gap-2">
          <legend className="sr-only">Siting of zone {zone.number}</legend>
          {SITING_ITEMS.map((item) => (
            <TouchCheckbox
              key={item}
              label={SITING_ITEM_LABELS[item]}
              registration={form.register(`answers.${item}`)}
            />
          ))}
        </fieldset>
        <TouchNoteField label="Siting note" registration={form.register('note')} />
        <div>
          <Button
            type="submit"
            variant="secondary"
            size="lg"
            disabled={form.formState.isSubmitting}
          >
            Save siting check
          </Button>
        </div>
        {/* Always there, so what arrives in it after saving is announced. */}
        <div role="status">
          {outcome?.kind === 'saved' ? (
            <Notice
              tone={outcome.allClear === false ? 'fault' : 'normal'}
              title={
                outcome.allClear === false
                  ? 'Siting saved: something to put right'
                  : 'Siting saved: all clear'
              }
            />
          ) : null}
          {outcome?.kind === 'kept-on-phone' ? (
            <KeptOnPhoneOutcome
              clientKey={outcome.clientKey}
              onPhone={onPhone}
              what={`The siting check of zone ${zone.number}`}
              title="Siting check kept on this phone until there is a connection"
            />
          ) : null}
        </div>
      </form>
    </section>
  );
}
