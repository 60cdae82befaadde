import { z } from 'zod';

import { customerSignatureInputSchema, signatureImageSchema } from '@server/handover/schema';
import { required } from '@server/schema/fields';

/** Said when Save is pressed on an empty pad, before anything is sent. */
export const EMPTY_SIGNATURE_MESSAGE = 'Draw the signature in the box before saving.';

/**
 * The pad hands the form '' while nothing is drawn; that gets a plain request to draw rather
 * than the API's wording about PNG images, which is for anything else that is wrong.
 */
export const signatureImageField = z
  .string()
  .min(1, EMPTY_SIGNATURE_MESSAGE)
  .pipe(signatureImageSchema);

/** The customer signing in person on the engineer's device: their name and a drawing. */
export const namedSignatureFormSchema = customerSignatureInputSchema.extend({
  image: signatureImageField,
});
export type SignatureFormValues = z.input<typeof namedSignatureFormSchema>;
export type NamedSignature = z.output<typeof namedSignatureFormSchema>;

/** The homeowner answering a signing request: the same, in words addressed to them. */
export const ownSignatureFormSchema = namedSignatureFormSchema.extend({
  name: required(120, 'Your name'),
});

/** The engineer signs as the signed-in person: there is no name to type, only the drawing. */
export const engineerSignatureFormSchema = z.object({
  name: z.string(),
  image: signatureImageField,
});

/**
 * Whose signature a form takes: the engineer's, the customer's in person, or the signed-in
 * homeowner's own. It decides whether a name is asked for and how messages speak of it.
 */
export type Signer = 'engineer' | 'customer' | 'self';

export const signatureFormSchemas: Record<
  Signer,
  z.ZodType<NamedSignature, SignatureFormValues>
> = {
  engineer: engineerSignatureFormSchema,
  customer: namedSignatureFormSchema,
  self: ownSignatureFormSchema,
};

/** Whether an API error path ("name", "image") names a field these forms show. */
export const isSignatureField = (fieldPath: string) =>
  fieldPath === 'name' || fieldPath === 'image';
