import { useId, useState, type FormEvent } from 'react';

import { FAULT_PHOTO_TYPES, faultReportInputSchema, MAX_FAULT_PHOTOS } from '@server/faults/schema';
import { MAX_FILE_BYTES } from '@server/files/schema';
import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { Notice } from '@/components/ui/notice';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { touchTextareaClassName } from '@/components/ui/touch-field-styles';
import { useReportFault, type ReportedFault } from '@/features/my-homes/api/report-fault';
import { ApiError } from '@/lib/api-client';

const ACCEPTED_TYPES: readonly string[] = FAULT_PHOTO_TYPES;

/** Why these photos cannot be sent, in words, before anything goes. */
function photoProblem(photos: readonly File[]): string | undefined {
  if (photos.length > MAX_FAULT_PHOTOS) return `Choose at most ${MAX_FAULT_PHOTOS} photos.`;
  const wrongType = photos.find((photo) => !ACCEPTED_TYPES.includes(photo.type));
  if (wrongType) return `${wrongType.name} is not a JPEG, PNG or WebP photo.`;
  const tooLarge = photos.find((photo) => photo.size > MAX_FILE_BYTES);
  if (tooLarge)
    return `${tooLarge.name} is larger than ${MAX_FILE_BYTES / 1024 / 1024} MiB: choose a smaller photo.`;
  return undefined;
}

/** The homeowner's fault report, with up to four photos, and the acknowledgement it gets. */
export function ReportFaultForm({ siteId }: { siteId: string }) {
  const headingId = useId();
  const [description, setDescription] = useState('');
  const [photos, setPhotos] = useState<File[]>([]);
  const [clientKey, setClientKey] = useState(() => crypto.randomUUID());
  // Changing it empties the file picker after a report is sent.
  const [pickerKey, setPickerKey] = useState(0);
  const [errors, setErrors] = useState<{ description?: string; photos?: string }>({});
  const [refusal, setRefusal] = useState<unknown>(null);
  const [reported, setReported] = useState<ReportedFault | null>(null);
  const report = useReportFault();

  async function submit(event: FormEvent) {
    event.preventDefault();
    setRefusal(null);
    const checked = faultReportInputSchema.safeParse({ description, clientKey });
    const found = {
      description: checked.success
        ? undefined
        : checked.error.issues.find((issue) => issue.path[0] === 'description')?.message,
      photos: photoProblem(photos),
    };
    setErrors(found);
    if (found.description || found.photos) return;
    try {
      const saved = await report.mutateAsync({ siteId, description, clientKey, photos });
      setReported(saved);
      setDescription('');
      setPhotos([]);
      setPickerKey((key) => key + 1);
      // The next report is a new record.
      setClientKey(crypto.randomUUID());
    } catch (error) {
      setRefusal(error);
      if (error instanceof ApiError)
        setErrors({
          description: error.messageFor('body.description'),
          photos: error.messageFor('body.photos'),
        });
    }
  }

  return (
    <section
      aria-labelledby={headingId}
      className="grid gap-4 rounded-lg border border-hairline bg-white px-4 py-4"
    >
      <h2 id={headingId} className="text-lg font-semibold">
        Report a fault
      </h2>
      {reported ? (
        <div role="status">
          <Notice tone="normal" title="Thank you: your fault report is with your alarm company.">
            <p>{reported.statusWords}.</p>
            <p>
              {reported.acknowledgementSent
                ? 'We have e-mailed you a copy.'
                : 'We could not e-mail you a copy just now, but your report is saved.'}
            </p>
            {reported.photos.length > 0 ? (
              <p>
                {reported.photos.length === 1
                  ? '1 photo is attached.'
                  : `${reported.photos.length} photos are attached.`}
              </p>
            ) : null}
          </Notice>
        </div>
      ) : null}
      <form noValidate onSubmit={submit} className="grid gap-4">
        {refusal ? (
          <ProblemAlert
            error={refusal}
            title="Your report was not sent. What you typed is still here: try again."
          />
        ) : null}
        <FormField
          label="What is wrong?"
          hint="What you see or hear, where, and since when. Never include your alarm code."
          error={errors.description}
        >
          {(control) => (
            <textarea
              {...control}
              value={description}
              onChange={(event) => setDescription(event.target.value)}
              className={touchTextareaClassName({ invalid: Boolean(errors.description) })}
            />
          )}
        </FormField>
        <FormField
          label="Photos"
          optional
          hint={`Up to ${MAX_FAULT_PHOTOS} photos (JPEG, PNG or WebP), taken from the ground.`}
          error={errors.photos}
        >
          {(control) => (
            <input
              {...control}
              key={pickerKey}
              type="file"
              multiple
              accept={FAULT_PHOTO_TYPES.join(',')}
              onChange={(event) => setPhotos(Array.from(event.target.files ?? []))}
              className="block min-h-12 w-full text-base"
            />
          )}
        </FormField>
        <Button type="submit" variant="primary" size="lg" disabled={report.isPending}>
          {report.isPending ? 'Sending…' : 'Send the fault report'}
        </Button>
      </form>
    </section>
  );
}
