import { uploadFieldsSchema, type SiteFile } from '@server/files/schema';
import { Upload, X } from 'lucide-react';
import { useId, useRef, useState, type FormEvent } from 'react';

import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { ProgressBar } from '@/components/ui/progress-bar';
import { touchInputClassName } from '@/components/ui/touch-field-styles';
import { useUploadSiteFile } from '@/features/files/api/upload-site-file';
import {
  ACCEPTED_FILES,
  ACCEPTED_FILES_SENTENCE,
  checkFileBeforeUpload,
} from '@/features/files/components/file-kinds';
import { ApiError, type UploadProgress } from '@/lib/api-client';
import { formatFileSize } from '@/lib/file-size';

type FileUploadFormProps = {
  siteId: string;
  onUploaded: (file: SiteFile) => void;
};

function isCancelled(error: unknown): boolean {
  return error instanceof DOMException && error.name === 'AbortError';
}

// The API's 413 and 415 answers say what went wrong; this says what to do about it.
function hintFor(error: unknown): string | undefined {
  if (error instanceof ApiError && (error.status === 413 || error.status === 415)) {
    return ACCEPTED_FILES_SENTENCE;
  }
  return undefined;
}

/** Choose a photo or document, describe it, and watch it go. */
export function FileUploadForm({ siteId, onUploaded }: FileUploadFormProps) {
  const formRef = useRef<HTMLFormElement>(null);
  const fileInputRef = useRef<HTMLInputElement>(null);
  const abortController = useRef<AbortController | null>(null);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const [description, setDescription] = useState('');
  const [descriptionError, setDescriptionError] = useState<string | undefined>();
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const headingId = useId();

  const upload = useUploadSiteFile({
    mutationConfig: {
      onSuccess: (uploaded) => {
        formRef.current?.reset();
        setFile(null);
        setDescription('');
        onUploaded(uploaded);
      },
      onSettled: () => {
        abortController.current = null;
        setProgress(null);
      },
    },
  });

  const chooseFile = (chosen: File | null) => {
    upload.reset();
    setFile(chosen);
    setFileError(chosen ? (checkFileBeforeUpload(chosen) ?? undefined) : undefined);
  };

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const problem = file ? checkFileBeforeUpload(file) : 'Choose a photo or document to upload.';
    const fields = uploadFieldsSchema.safeParse({ description });
    setFileError(problem ?? undefined);
    setDescriptionError(fields.success ? undefined : fields.error.issues[0]?.message);
    if (problem || !file) {
      fileInputRef.current?.focus();
      return;
    }
    if (!fields.success) return;

    abortController.current = new AbortController();
    setProgress({ loadedBytes: 0, totalBytes: file.size });
    upload.mutate({
      siteId,
      file,
      description: fields.data.description,
      onProgress: setProgress,
      signal: abortController.current.signal,
    });
  };

  const percent =
    progress && progress.totalBytes > 0 ? (progress.loadedBytes / progress.totalBytes) * 100 : 0;

  return (
    <section aria-labelledby={headingId} className="grid gap-4">
      <h3 id={headingId} className="text-lg font-semibold">
        Add a photo or document
      </h3>
      <form ref={formRef} noValidate onSubmit={submit} className="grid gap-4">
        <FormField label="File to upload" hint={ACCEPTED_FILES_SENTENCE} error={fileError}>
          {(fieldProps) => (
            <input
              {...fieldProps}
              ref={fileInputRef}
              type="file"
              name="file"
              accept={ACCEPTED_FILES}
              disabled={upload.isPending}
              onChange={(event) => chooseFile(event.target.files?.[0] ?? null)}
              className="block w-full text-base file:mr-3 file:min-h-12 file:cursor-pointer file:rounded-md file:border file:border-ink/35 file:bg-white file:px-4 file:font-semibold file:text-ink hover:file:bg-paper-deep"
            />
          )}
        </FormField>
        {/* Field errors are not announced by themselves; a wrong file is, as soon as it is chosen. */}
        <p role="alert" className="sr-only">
          {fileError}
        </p>
        <FormField
          label="Description"
          optional
          hint="What it shows, e.g. “Panel location under the stairs”."
          error={descriptionError}
        >
          {(fieldProps) => (
            <input
              {...fieldProps}
              type="text"
              name="description"
              maxLength={200}
              value={description}
              disabled={upload.isPending}
              onChange={(event) => setDescription(event.target.value)}
              className={touchInputClassName({ invalid: Boolean(descriptionError) })}
            />
          )}
        </FormField>

        {progress && file ? (
          <ProgressBar
            label={`Uploading ${file.name}`}
            percent={percent}
            valueText={`${formatFileSize(progress.loadedBytes)} of ${formatFileSize(progress.totalBytes)}`}
          />
        ) : null}

        {upload.isError && !isCancelled(upload.error) ? (
          <ProblemAlert error={upload.error} hint={hintFor(upload.error)} />
        ) : null}
        {upload.isError && isCancelled(upload.error) ? (
          <p role="status">Upload cancelled. Nothing was saved.</p>
        ) : null}

        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" size="lg" disabled={upload.isPending}>
            <Upload aria-hidden="true" className="size-5" />
            Upload file
          </Button>
          {upload.isPending ? (
            <Button variant="secondary" size="lg" onClick={() => abortController.current?.abort()}>
              <X aria-hidden="true" className="size-5" />
              Cancel upload
            </Button>
          ) : null}
        </div>
      </form>
    </section>
  );
}
