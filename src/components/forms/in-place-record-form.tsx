import { useEffect, type ReactNode } from 'react';
import { FormProvider, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form';

import { Button } from '@/components/ui/button';
import { FormProblem } from '@/components/ui/form-problem';
import { LoadingStatus } from '@/components/ui/loading-status';
import { countFieldErrors } from '@/lib/form-errors';

type InPlaceRecordFormProps<Values extends FieldValues, Output> = {
  form: UseFormReturn<Values, unknown, Output>;
  /** The heading above the form, which names it. */
  headingId: string;
  /** Where typing starts as soon as the form opens. */
  firstField: Path<Values>;
  onSubmit: (data: Output) => void;
  /** What is being saved, as the start of a sentence: "The keyholder", "Slot 4". */
  subject: string;
  /** The API's refusal, if the save was sent and refused. */
  error: unknown;
  unplacedMessages: readonly string[];
  /** Offered when someone else saved first; only forms that change a saved record have it. */
  onReloadLatest?: () => void;
  isReloading?: boolean;
  saveLabel: string;
  isSaving: boolean;
  onCancel: () => void;
  /**
   * Said beside the buttons, e.g. that the form now shows the latest saved details. Give a
   * string (empty at first) to have the status region there from the start.
   */
  statusMessage?: string;
  children: ReactNode;
};

/**
 * A phone-sized form that opens in place within a list, to add one entry or change it: the
 * problem summary, the fields, then Save and Cancel.
 */
export function InPlaceRecordForm<Values extends FieldValues, Output>({
  form,
  headingId,
  firstField,
  onSubmit,
  subject,
  error,
  unplacedMessages,
  onReloadLatest,
  isReloading,
  saveLabel,
  isSaving,
  onCancel,
  statusMessage,
  children,
}: InPlaceRecordFormProps<Values, Output>) {
  const { setFocus, formState } = form;

  // The form opens from a button ("Add keyholder", "Edit"); typing starts at once in its first field.
  useEffect(() => setFocus(firstField), [setFocus, firstField]);

  return (
    <FormProvider {...form}>
      <form
        noValidate
        aria-labelledby={headingId}
        onSubmit={form.handleSubmit(onSubmit)}
        className="grid gap-5"
      >
        <FormProblem
          subject={subject}
          fieldErrorCount={formState.submitCount > 0 ? countFieldErrors(formState.errors) : 0}
          error={error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={onReloadLatest}
          isReloading={isReloading}
        />
        {children}
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" size="lg" disabled={isSaving}>
            {saveLabel}
          </Button>
          <Button variant="secondary" size="lg" onClick={onCancel}>
            Cancel
          </Button>
          {isSaving ? <LoadingStatus label="Saving" /> : null}
          {statusMessage === undefined ? null : (
            <p role="status" className="font-semibold">
              {statusMessage}
            </p>
          )}
        </div>
      </form>
    </FormProvider>
  );
}
