import { useEffect, useImperativeHandle, useRef, useState, type Ref } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { ListChecks, Plus, Trash2 } from 'lucide-react';
import { useFieldArray, useForm } from 'react-hook-form';
import { z } from 'zod';

import type { HandoverState } from '@server/handover/schema';
import { required } from '@server/schema/fields';
import { SaveRow } from '@/components/forms/save-row';
import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { FormProblem } from '@/components/ui/form-problem';
import { Notice } from '@/components/ui/notice';
import { touchTextareaClassName } from '@/components/ui/touch-field-styles';
import { getHandoverQueryOptions } from '@/features/handover/api/get-handover';
import { useSaveVariations } from '@/features/handover/api/save-variations';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';
import { useReloadLatest } from '@/lib/use-reload-latest';
import { useShowNewerSavedVersion } from '@/lib/use-show-newer-saved-version';
import { useUnsavedChangesGuard } from '@/lib/use-unsaved-changes-guard';

// The API takes a list of strings; the form keeps objects so each row has a stable key.
const variationsFormSchema = z.object({
  variations: z
    .array(z.object({ text: required(1000, 'The variation') }))
    .max(50, 'At most 50 variations.'),
  version: z.number().int().positive().nullable(),
});
type VariationsFormValues = z.input<typeof variationsFormSchema>;
type Draft = HandoverState['draft'];

function toFormValues(draft: Draft): VariationsFormValues {
  return {
    variations: draft.variations.map((variation) => ({ text: variation.text })),
    version: draft.version,
  };
}

/** What the rest of the page may ask of the editor. */
export type VariationsEditorHandle = {
  /** Adds a variation starting with these words and puts the cursor in it. */
  addVariation: (text: string) => void;
};

type VariationsEditorProps = {
  siteId: string;
  draft: Draft;
  ref?: Ref<VariationsEditorHandle>;
};

const addButtonId = 'add-variation';

/**
 * The variations: departures from the design written in words (a zone left out at the
 * customer's request, a detector sited where the check advises against). Every blocking problem
 * still open must be one of them, and the customer accepts the list by signing.
 */
export function VariationsEditor({ siteId, draft, ref }: VariationsEditorProps) {
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  // Said after a save, for as long as the draft is still the version that save made.
  const [saved, setSaved] = useState<{ message: string; version: number } | null>(null);
  const queryClient = useQueryClient();
  // After a row goes, the keyboard carries on from its neighbour rather than the top of the page.
  const focusAfterRemove = useRef<number | 'add' | null>(null);
  const form = useForm<VariationsFormValues, unknown, z.output<typeof variationsFormSchema>>({
    resolver: zodResolver(variationsFormSchema),
    defaultValues: toFormValues(draft),
  });
  const { register, control, formState } = form;
  const { errors, isDirty } = formState;
  const variations = useFieldArray({ control, name: 'variations' });

  useShowNewerSavedVersion({
    form,
    versionField: 'version',
    saved: draft,
    savedVersion: draft.version,
    toFormValues,
  });

  const saveVariations = useSaveVariations({
    onSuccess: (state) => {
      form.reset(toFormValues(state.draft));
      setSaved({
        message:
          state.draft.variations.length === 0 ? 'Saved: no variations.' : 'Variations saved.',
        version: state.draft.version,
      });
    },
    onError: (error) =>
      setUnplacedMessages(
        applyServerFieldErrors(error, form.setError, (field) => field.startsWith('variations')),
      ),
  });

  useUnsavedChangesGuard(isDirty && !saveVariations.isPending);

  useEffect(() => {
    const target = focusAfterRemove.current;
    if (target === null) return;
    focusAfterRemove.current = null;
    if (target === 'add') document.getElementById(addButtonId)?.focus();
    else form.setFocus(`variations.${target}.text`);
  });

  // After a 409: what is saved now, new version included, replaces what was typed.
  const { isReloading, reloadLatest } = useReloadLatest(async () => {
    const latest = await queryClient.fetchQuery({
      ...getHandoverQueryOptions(siteId),
      staleTime: 0,
    });
    form.reset(toFormValues(latest.draft));
    saveVariations.reset();
    setUnplacedMessages([]);
    setSaved({ message: 'Showing the latest saved variations.', version: latest.draft.version });
  });

  // append() puts the cursor in the new variation by itself.
  const { append } = variations;
  useImperativeHandle(ref, () => ({ addVariation: (text: string) => append({ text }) }), [append]);

  const submit = form.handleSubmit(({ variations: rows, version }) => {
    setUnplacedMessages([]);
    setSaved(null);
    saveVariations.mutate({ siteId, variations: rows.map((row) => row.text), version });
  });

  const customer = draft.customerSignature;
  const savedMessage = saved && saved.version === draft.version && !isDirty ? saved.message : '';

  return (
    <section aria-labelledby="variations-heading" className="grid gap-4">
      <div>
        <h2 id="variations-heading" className="flex items-center gap-2 text-xl font-semibold">
          <ListChecks aria-hidden="true" className="size-6 shrink-0" />
          Variations
        </h2>
        <p className="max-w-prose text-sm text-ink-muted">
          Write down, in words the customer will understand, each way the system differs from its
          design. Every blocking problem that is not put right must be written here as a variation
          and accepted by the customer, who accepts the whole list by signing. The list appears on
          the completion certificate.
        </p>
      </div>
      {customer ? (
        <Notice tone="fault" title="Changing the variations clears the customer’s signature">
          <p>
            {customer.name} has signed to accept the list as it is. If you save a changed list, they
            will need to sign again to accept the new one.
          </p>
        </Notice>
      ) : null}
      <form
        noValidate
        onSubmit={submit}
        aria-labelledby="variations-heading"
        className="grid gap-4"
      >
        <FormProblem
          key={formState.submitCount}
          subject="The list of variations"
          fieldErrorCount={countFieldErrors(errors)}
          error={saveVariations.error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={reloadLatest}
          isReloading={isReloading}
        />
        {variations.fields.length === 0 ? (
          <p className="rounded-lg border border-dashed border-hairline bg-white px-4 py-6 text-center text-ink-muted">
            No variations. Add one for each departure from the design the customer is to accept.
          </p>
        ) : (
          <ol aria-label="Variations" className="grid gap-3">
            {variations.fields.map((field, index) => {
              const rowError = errors.variations?.[index];
              const message = rowError?.text?.message ?? rowError?.message;
              return (
                <li
                  key={field.id}
                  className="grid gap-3 rounded-lg border border-hairline bg-white p-3"
                >
                  <FormField label={`Variation ${index + 1}`} error={message}>
                    {(fieldProps) => (
                      <textarea
                        {...fieldProps}
                        {...register(`variations.${index}.text`)}
                        rows={3}
                        className={touchTextareaClassName({
                          invalid: Boolean(message),
                          className: 'min-h-24',
                        })}
                      />
                    )}
                  </FormField>
                  <div>
                    <Button
                      variant="secondary"
                      size="lg"
                      onClick={() => {
                        const rowsLeft = variations.fields.length - 1;
                        focusAfterRemove.current =
                          rowsLeft === 0 ? 'add' : Math.min(index, rowsLeft - 1);
                        variations.remove(index);
                      }}
                    >
                      <Trash2 aria-hidden="true" className="size-5" />
                      Remove variation {index + 1}
                    </Button>
                  </div>
                </li>
              );
            })}
          </ol>
        )}
        {errors.variations?.message || errors.variations?.root?.message ? (
          <p role="alert" className="text-sm font-semibold text-alarm">
            {errors.variations.message ?? errors.variations.root?.message}
          </p>
        ) : null}
        <div>
          <Button
            id={addButtonId}
            variant="secondary"
            size="lg"
            onClick={() => append({ text: '' })}
          >
            <Plus aria-hidden="true" className="size-5" />
            Add a variation
          </Button>
        </div>
        <SaveRow
          saveLabel="Save variations"
          isSaving={saveVariations.isPending}
          savedMessage={savedMessage}
          size="lg"
        />
      </form>
    </section>
  );
}
