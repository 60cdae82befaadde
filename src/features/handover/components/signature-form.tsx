import { useState, type ReactNode } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { PenLine } from 'lucide-react';
import { Controller, useForm } from 'react-hook-form';

import { MAX_SIGNATURE_BYTES } from '@server/handover/schema';
import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { FormProblem } from '@/components/ui/form-problem';
import { LoadingStatus } from '@/components/ui/loading-status';
import { SignaturePad } from '@/components/ui/signature-pad';
import { touchInputClassName } from '@/components/ui/touch-field-styles';
import {
  isSignatureField,
  signatureFormSchemas,
  type NamedSignature,
  type SignatureFormValues,
  type Signer,
} from '@/features/handover/utils/signature-form';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';

type SignatureFormProps = {
  signer: Signer;
  /** The heading that names the form. */
  headingId: string;
  /** For the customer and the homeowner: "Customer’s full name", "Your full name". */
  nameField?: { label: string; defaultName: string };
  /** Names the pad and its buttons: "Customer’s signature". */
  padLabel: string;
  /** The heading above already says what the pad is for. */
  padLabelVisuallyHidden?: boolean;
  /** What is being saved, as the start of a sentence, for the problem summary. */
  subject: string;
  submitLabel: string;
  /** Said before the button: what signing means. */
  statement?: ReactNode;
  /**
   * Sends the signature (the engineer's `name` is '': theirs comes from their account). A
   * refusal is thrown back, and the form keeps the name and the drawing to try again.
   */
  onSign: (signature: NamedSignature) => Promise<unknown>;
};

/** A drawn signature, with the signer's name where one is asked for, and a button to save it. */
export function SignatureForm({
  signer,
  headingId,
  nameField,
  padLabel,
  padLabelVisuallyHidden = false,
  subject,
  submitLabel,
  statement,
  onSign,
}: SignatureFormProps) {
  const [refusal, setRefusal] = useState<unknown>(null);
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const form = useForm<SignatureFormValues, unknown, NamedSignature>({
    resolver: zodResolver(signatureFormSchemas[signer]),
    defaultValues: { name: nameField?.defaultName ?? '', image: '' },
  });
  const { errors, isSubmitting, submitCount } = form.formState;

  const submit = form.handleSubmit(async (signature) => {
    setRefusal(null);
    setUnplacedMessages([]);
    try {
      await onSign(signature);
    } catch (error) {
      setRefusal(error);
      setUnplacedMessages(applyServerFieldErrors(error, form.setError, isSignatureField));
    }
  });

  return (
    <form noValidate onSubmit={submit} aria-labelledby={headingId} className="grid gap-5">
      <FormProblem
        key={submitCount}
        subject={subject}
        fieldErrorCount={countFieldErrors(errors)}
        error={refusal}
        unplacedMessages={unplacedMessages}
      />
      {nameField ? (
        <FormField label={nameField.label} error={errors.name?.message}>
          {(fieldProps) => (
            <input
              {...fieldProps}
              {...form.register('name')}
              type="text"
              autoComplete="name"
              className={touchInputClassName({ invalid: Boolean(errors.name) })}
            />
          )}
        </FormField>
      ) : null}
      <Controller
        control={form.control}
        name="image"
        render={({ field, fieldState }) => (
          <SignaturePad
            ref={field.ref}
            label={padLabel}
            labelVisuallyHidden={padLabelVisuallyHidden}
            onChange={field.onChange}
            error={fieldState.error?.message}
            maxImageBytes={MAX_SIGNATURE_BYTES}
            disabled={isSubmitting}
          />
        )}
      />
      {statement ? <div className="max-w-prose">{statement}</div> : null}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" size="lg" disabled={isSubmitting}>
          <PenLine aria-hidden="true" className="size-5" />
          {isSubmitting ? 'Saving…' : submitLabel}
        </Button>
        {isSubmitting ? <LoadingStatus label="Saving the signature" /> : null}
      </div>
    </form>
  );
}
