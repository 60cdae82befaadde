import { useId, useRef, useState } from 'react';
import { FileSearch } from 'lucide-react';

import type { PdfCheck } from '@server/handover/schema';
import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { Notice } from '@/components/ui/notice';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { useCheckPackPdf } from '@/features/handover/api/check-pack-pdf';
import { ApiError } from '@/lib/api-client';
import { formatFileSize } from '@/lib/file-size';

const isPdf = (file: File) => file.type === 'application/pdf' || /\.pdf$/i.test(file.name);

/**
 * Checks a copy of the pack someone holds against the issued one: the file goes to the server
 * as it is and is compared byte for byte by its SHA-256.
 */
export function PdfCheckForm({ packNumber }: { packNumber: string }) {
  const inputRef = useRef<HTMLInputElement>(null);
  const headingId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const checkPdf = useCheckPackPdf();
  const result = checkPdf.data;

  // A refusal about the file itself belongs beside the file field; anything else goes above it.
  const refusal = checkPdf.error;
  const fieldMessage =
    refusal instanceof ApiError && refusal.fieldErrors.length > 0
      ? refusal.fieldErrors.map((fieldError) => fieldError.message).join(' ')
      : undefined;

  return (
    <section aria-labelledby={headingId} className="grid gap-4">
      <h2 id={headingId} className="flex items-center gap-2 text-xl font-semibold">
        <FileSearch aria-hidden="true" className="size-6 shrink-0" />
        Check a copy of the PDF
      </h2>
      <p className="max-w-prose text-sm text-ink-muted">
        Choose the PDF you were given. Wardbook compares it with the pack as issued: any change at
        all, even one character, and it will not match.
      </p>
      <form
        noValidate
        aria-labelledby={headingId}
        className="grid gap-4"
        onSubmit={(event) => {
          event.preventDefault();
          if (!file) {
            setFileError('Choose a PDF file first.');
            inputRef.current?.focus();
            return;
          }
          if (!isPdf(file)) {
            setFileError('That is not a PDF. Choose the pack’s PDF file (its name ends in .pdf).');
            inputRef.current?.focus();
            return;
          }
          setFileError(undefined);
          checkPdf.mutate({ packNumber, file });
        }}
      >
        {refusal && !fieldMessage ? <ProblemAlert error={refusal} /> : null}
        <FormField label="PDF file" error={fileError ?? fieldMessage}>
          {(fieldProps) => (
            <input
              {...fieldProps}
              ref={inputRef}
              type="file"
              accept="application/pdf,.pdf"
              onChange={(event) => {
                setFile(event.target.files?.[0] ?? null);
                setFileError(undefined);
                checkPdf.reset();
              }}
              className="block min-h-12 w-full rounded-md border border-ink-muted bg-white p-2 text-base file:mr-3 file:min-h-10 file:rounded-md file:border file:border-ink/35 file:bg-paper file:px-4 file:font-semibold file:text-ink"
            />
          )}
        </FormField>
        <div>
          <Button type="submit" size="lg" disabled={checkPdf.isPending}>
            <FileSearch aria-hidden="true" className="size-5" />
            {checkPdf.isPending ? 'Checking…' : 'Check this file'}
          </Button>
        </div>
      </form>
      <div role="status">{result ? <PdfCheckResult result={result} /> : null}</div>
    </section>
  );
}

function PdfCheckResult({ result }: { result: PdfCheck }) {
  return (
    <div className="grid gap-3">
      {result.matches ? (
        <Notice tone="normal" title="This file matches the issued pack byte for byte">
          <p>It is an exact copy of pack {result.packNumber} as issued.</p>
        </Notice>
      ) : (
        <Notice tone="alarm" title="This file does not match the issued pack">
          <p>
            It is not an exact copy of pack {result.packNumber}: it may be a different pack, a
            preview, or a copy that has been changed.
          </p>
        </Notice>
      )}
      <dl className="grid gap-3 rounded-lg border border-hairline bg-white p-4">
        <div className="min-w-0">
          <dt className="text-sm text-ink-muted">SHA-256 of your file</dt>
          <dd className="font-mono text-sm break-all">{result.uploadedSha256}</dd>
        </div>
        <div className="min-w-0">
          <dt className="text-sm text-ink-muted">SHA-256 of the issued pack</dt>
          <dd className="font-mono text-sm break-all">{result.expectedSha256}</dd>
        </div>
        <div className="min-w-0">
          <dt className="text-sm text-ink-muted">Size of your file</dt>
          <dd className="font-mono text-sm">
            {formatFileSize(result.uploadedBytes)} ({result.uploadedBytes.toLocaleString('en-GB')}{' '}
            bytes)
          </dd>
        </div>
      </dl>
    </div>
  );
}
